import { z } from 'zod';
import { ROLES } from '@/lib/auth/permissions';
import { email } from './account';

export const inviteSchema = z.object({ email, role: z.enum(ROLES) }).strict();
export const roleSchema = z.object({ role: z.enum(ROLES) }).strict();
export const meSchema = z.object({ notifyEmail: z.boolean() }).strict();
