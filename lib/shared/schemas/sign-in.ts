import * as z from '@/lib/shared/zod';
import { EMAIL_MAX, EMAIL_MESSAGE, PASSWORD_MAX, PASSWORD_MISSING, PASSWORD_TOO_LONG } from '../sign-in-rules';

// The credentials check on the server; the sign-in form checks the same limits (sign-in-rules.ts).
export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email(EMAIL_MESSAGE).max(EMAIL_MAX, EMAIL_MESSAGE),
  password: z.string().min(1, PASSWORD_MISSING).max(PASSWORD_MAX, PASSWORD_TOO_LONG),
});
export type SignInInput = z.infer<typeof signInSchema>;
