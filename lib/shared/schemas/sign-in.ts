import { z } from '@/lib/shared/zod';

// Shared by the sign-in form and the credentials check on the server.
export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter the e-mail address you were invited with.').max(254),
  password: z.string().min(1, 'Enter your password.').max(200, 'That password is too long.'),
});
export type SignInInput = z.infer<typeof signInSchema>;
