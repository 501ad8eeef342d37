import { z } from 'zod';
import { hasNoNul, NUL_MESSAGE } from './text';

/** Minimum password length for new accounts. */
export const PASSWORD_MIN_LENGTH = 10;

export const roles = ['admin', 'member'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

export const emailSchema = z.string({ error: 'E-mail is required' })
  .trim()
  .toLowerCase()
  .max(254, 'E-mail is too long')
  .pipe(z.email({ error: 'Enter a valid e-mail address' }));

export const registerRequestSchema = z.object({
  name: z.string({ error: 'Name is required' }).trim().min(1, 'Name is required').max(100, 'Name is at most 100 characters').refine(hasNoNul, NUL_MESSAGE),
  email: emailSchema,
  password: z.string({ error: 'Password is required' })
    .min(PASSWORD_MIN_LENGTH, `Password must be at least ${PASSWORD_MIN_LENGTH} characters`)
    .max(200, 'Password is at most 200 characters'),
});
export type RegisterRequest = z.infer<typeof registerRequestSchema>;

export const loginRequestSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Password is required' }).min(1, 'Password is required').max(200),
});
export type LoginRequest = z.infer<typeof loginRequestSchema>;

/** An account as the API shows it (never the password hash). */
export const userSchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  disabled: z.boolean(),
  createdAt: z.string(),
});
export type User = z.infer<typeof userSchema>;

export const userResponseSchema = z.object({ user: userSchema });
export const userListResponseSchema = z.object({ users: z.array(userSchema) });

/** What an admin may change on an account. */
export const userUpdateRequestSchema = z.object({
  role: roleSchema.optional(),
  disabled: z.boolean().optional(),
}).refine((v) => v.role !== undefined || v.disabled !== undefined, { message: 'Nothing to change', path: ['_'] });
export type UserUpdateRequest = z.infer<typeof userUpdateRequestSchema>;
