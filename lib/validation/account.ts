import { z } from 'zod';

export const email = z.string().trim().toLowerCase().pipe(z.email('Enter an e-mail address like kettle@example.test.'));

export const signUpSchema = z.object({
  name: z.string().trim().min(1, 'Tell us your name.').max(80, 'Keep the name under 80 characters.'),
  email,
  password: z.string().min(10, 'Use at least 10 characters.').max(200, 'Use at most 200 characters.'),
});
export type SignUpInput = z.input<typeof signUpSchema>;

export const signInSchema = z.object({
  email,
  password: z.string().min(1, 'Enter your password.'),
});
export type SignInInput = z.input<typeof signInSchema>;
