import { z } from 'zod';

/** `POST /api/auth/sign-in` body; the web form validates with the same schema. */
export const signInRequestSchema = z.object({
  email: z
    .string()
    .trim()
    .min(1, 'Enter your e-mail address.')
    .pipe(z.email('Enter a valid e-mail address, like name@company.example.')),
  password: z.string().min(1, 'Enter your password.'),
});
export type SignInRequest = z.infer<typeof signInRequestSchema>;
