import { z } from 'zod';
import { ROLES } from '@/lib/auth/permissions';
import { email, newPassword } from './account';

export const inviteSchema = z
  .object({
    email,
    role: z.enum(ROLES),
    /** False (the default): only the account with this e-mail address may accept. True: whoever has the link. */
    anyoneWithLink: z.boolean().default(false),
  })
  .strict();
export const roleSchema = z.object({ role: z.enum(ROLES) }).strict();

/** `PATCH /api/me`: notifications on or off, or a new password (with the current one), or both. */
export const meSchema = z
  .object({
    notifyEmail: z.boolean().optional(),
    currentPassword: z.string().min(1, 'Enter your current password.').max(512).optional(),
    newPassword: newPassword.optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.newPassword !== undefined && v.currentPassword === undefined) {
      ctx.addIssue({ code: 'custom', path: ['currentPassword'], message: 'Enter your current password to choose a new one.' });
    }
    if (v.currentPassword !== undefined && v.newPassword === undefined) {
      ctx.addIssue({ code: 'custom', path: ['newPassword'], message: 'Choose the new password.' });
    }
    if (v.notifyEmail === undefined && v.newPassword === undefined && v.currentPassword === undefined) {
      ctx.addIssue({ code: 'custom', message: 'Send notifyEmail, or currentPassword and newPassword.' });
    }
  });
