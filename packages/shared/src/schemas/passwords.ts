import { z } from 'zod';
import { emailSchema, newPasswordSchema } from './common.ts';

/** A signed-in person changing their own password. */
export const changePasswordBody = z.strictObject({
  currentPassword: z.string().min(1, 'Enter your current password').max(200),
  newPassword: newPasswordSchema,
});
export type ChangePasswordBody = z.infer<typeof changePasswordBody>;

/** Asking for a reset link; the answer is the same whether or not the e-mail has an account. */
export const passwordResetRequestBody = z.strictObject({ email: emailSchema });
export type PasswordResetRequestBody = z.infer<typeof passwordResetRequestBody>;

/** Reset tokens are 32 random bytes in base64url, as invite tokens are. */
export const resetToken = z.string().regex(/^[A-Za-z0-9_-]{43}$/, 'This reset link is not valid');
export const resetTokenParams = z.strictObject({ token: resetToken });
export const acceptPasswordResetBody = z.strictObject({ token: resetToken, password: newPasswordSchema });
export type AcceptPasswordResetBody = z.infer<typeof acceptPasswordResetBody>;

/** Whose password an open reset link sets, and until when it works. */
export interface PasswordResetView {
  email: string;
  name: string;
  expiresAt: string;
}
