// Accounts: sign-up, sign-in and a password change. The password rules follow OWASP ASVS 4.0.3 V2.1; the
// check against common passwords (V2.1.7) needs the shipped list and runs on the server only
// (lib/auth/common-passwords.ts).
import { z } from 'zod';
import { oneLine, textProblem } from './text';

export const email = z.string().trim().toLowerCase().pipe(z.email('Enter an e-mail address like kettle@example.test.'));

import { PASSWORD_MAX, PASSWORD_MIN } from './password-limits';

export { PASSWORD_MAX, PASSWORD_MIN };

/** Characters (code points, so an emoji is one) as ASVS 2.1.1 counts them: a run of spaces is one. */
export function passwordLength(password: string): number {
  return [...password.replace(/ {2,}/g, ' ')].length;
}

/** Why a new password is refused, or null. The password is kept exactly as typed: nothing is trimmed or cut (ASVS 2.1.3). */
export function passwordProblem(password: string): string | null {
  if (password.trim() === '') return 'A password needs more than spaces.';
  const unclean = textProblem(password, 'The password');
  if (unclean) return unclean;
  if ([...password].length > PASSWORD_MAX) return `Use at most ${PASSWORD_MAX} characters.`;
  if (passwordLength(password) < PASSWORD_MIN) return `Use at least ${PASSWORD_MIN} characters (a run of spaces counts as one).`;
  return null;
}

/** A password being chosen (sign-up, a change): the rules above. */
export const newPassword = z
  .string()
  // A cheap ceiling before counting characters: 128 code points are at most 256 UTF-16 units.
  .max(PASSWORD_MAX * 2, `Use at most ${PASSWORD_MAX} characters.`)
  .superRefine((s, ctx) => {
    const problem = passwordProblem(s);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  });

export const personName = oneLine('The name').min(1, 'Tell us your name.').max(80, 'Keep the name under 80 characters.');

export const signUpSchema = z.object({
  name: personName,
  email,
  password: newPassword,
});
export type SignUpInput = z.input<typeof signUpSchema>;

/** Signing up from an invitation tied to one address: that address is the account's, so the form sends the link's token instead. */
export const invitedSignUpSchema = z.object({ name: personName, password: newPassword });

/** `POST /api/users`: `{ name, email, password }`, or `{ name, invitation, password }` to take the invitation's address. */
export const signUpBodySchema = z
  .object({
    name: personName,
    email: email.optional(),
    invitation: oneLine('The invitation').min(1).max(200).optional(),
    password: newPassword,
  })
  .superRefine((v, ctx) => {
    if ((v.email === undefined) === (v.invitation === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['email'], message: 'Enter your e-mail address (or sign up from an invitation, not both).' });
    }
  });

export const signInSchema = z.object({
  email,
  // Any stored password is at most 200 characters (128 since ASVS); a longer one cannot match.
  password: z.string().min(1, 'Enter your password.').max(512),
});
export type SignInInput = z.input<typeof signInSchema>;

/** `PATCH /api/me` with a new password: the current one too, so a borrowed session cannot take the account. */
export const passwordChangeSchema = z
  .object({
    currentPassword: z.string().min(1, 'Enter your current password.').max(512),
    newPassword,
  })
  .strict();
export type PasswordChangeInput = z.input<typeof passwordChangeSchema>;
