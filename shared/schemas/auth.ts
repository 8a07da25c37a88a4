import { z } from 'zod';
import { ROLES } from '../auth/roles';
import { stripControlChars } from './clean-text';

export const emailSchema = z
  .string({ error: 'Enter an e-mail address' })
  .trim()
  .toLowerCase()
  .max(254, 'That e-mail address is too long')
  .pipe(z.email({ error: 'That is not an e-mail address' }));

export const newPasswordSchema = z
  .string({ error: 'Enter a password' })
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters');

export const personNameSchema = z
  .string({ error: 'Enter a name' })
  .overwrite(stripControlChars)
  .trim()
  .min(1, 'Enter a name')
  .max(100, 'Use at most 100 characters');

export const roleSchema = z.enum(ROLES, { error: 'Role must be engineer, moderator or admin' });

export const loginSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password' }).min(1, 'Enter your password').max(200),
});
export type LoginInput = z.infer<typeof loginSchema>;

export const userSchema = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
});
export type User = z.infer<typeof userSchema>;

export const personSchema = userSchema.extend({
  active: z.boolean(),
  createdAt: z.string(),
  pendingInvitation: z.boolean(),
});
export type Person = z.infer<typeof personSchema>;

export const inviteSchema = z.object({ email: emailSchema, role: roleSchema });
export type InviteInput = z.infer<typeof inviteSchema>;

export const updatePersonSchema = z
  .object({ role: roleSchema.optional(), active: z.boolean().optional() })
  .refine((v) => v.role !== undefined || v.active !== undefined, { error: 'Nothing to change' });
export type UpdatePersonInput = z.infer<typeof updatePersonSchema>;

export const tokenSchema = z.string().trim().min(20, 'That link is incomplete').max(200);

export const acceptInvitationSchema = z.object({
  token: tokenSchema,
  name: personNameSchema,
  password: newPasswordSchema,
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;

export const resetRequestSchema = z.object({ email: emailSchema });
export type ResetRequestInput = z.infer<typeof resetRequestSchema>;

export const resetConfirmSchema = z.object({ token: tokenSchema, password: newPasswordSchema });
export type ResetConfirmInput = z.infer<typeof resetConfirmSchema>;

export const profileSchema = z.object({ name: personNameSchema });
export type ProfileInput = z.infer<typeof profileSchema>;

export const changePasswordSchema = z.object({
  currentPassword: z.string().min(1, 'Enter your current password').max(200),
  newPassword: newPasswordSchema,
});
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

/** Client-side form adds a confirmation field; the server never sees it. */
export const confirmedPassword = <T extends z.ZodRawShape>(shape: T, field: keyof T & string) =>
  z
    .object({ ...shape, confirm: z.string() })
    .refine((v) => (v as Record<string, unknown>)[field] === (v as Record<string, unknown>).confirm, {
      error: 'The two passwords differ',
      path: ['confirm'],
    });

export const outboxMessageSchema = z.object({
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  createdAt: z.string(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

export const errorBodySchema = z.object({
  error: z.string(),
  issues: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;
