import { z } from 'zod';

export const signInSchema = z.object({
  email: z.email('enter a valid e-mail address').trim().toLowerCase(),
  password: z.string().min(1, 'enter your password').max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

/** Shortest password accepted when one is set (invitation, reset, first administrator). */
export const PASSWORD_MIN_LENGTH = 12;

export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `use at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(200, 'use at most 200 characters');

export const acceptInviteSchema = z.object({
  token: z.string().min(20, 'the invitation link is incomplete').max(200),
  password: passwordSchema,
});

export const forgotPasswordSchema = z.object({
  email: z.email('enter a valid e-mail address').trim().toLowerCase(),
});

export const resetPasswordSchema = z.object({
  token: z.string().min(20, 'the reset link is incomplete').max(200),
  password: passwordSchema,
});
