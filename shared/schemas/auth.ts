import { z } from 'zod';

/** The three roles; `admin` is never chosen at sign-up. */
export const Role = z.enum(['player', 'teacher', 'admin']);
export type Role = z.infer<typeof Role>;

export const Email = z
  .string({ error: 'Enter your e-mail address' })
  .trim()
  .toLowerCase()
  .pipe(
    z
      .email({ error: 'Enter an e-mail address such as you@example.com' })
      .max(254, { error: 'That address is too long' }),
  );

/** A new password: long enough to resist guessing, short enough to hash quickly. */
export const NewPassword = z
  .string({ error: 'Choose a password' })
  .min(8, { error: 'Use at least 8 characters' })
  .max(200, { error: 'Use at most 200 characters' });

export const DisplayName = z
  .string({ error: 'Enter your name' })
  .trim()
  .min(1, { error: 'Enter your name' })
  .max(80, { error: 'Keep your name under 80 characters' });

export const SignUpInput = z.object({
  email: Email,
  password: NewPassword,
  name: DisplayName,
  role: z.enum(['player', 'teacher'], { error: 'Choose player or teacher' }),
});
export type SignUpInput = z.infer<typeof SignUpInput>;

export const SignInInput = z.object({
  email: Email,
  password: z
    .string({ error: 'Enter your password' })
    .min(1, { error: 'Enter your password' })
    .max(200, { error: 'That password is too long' }),
});
export type SignInInput = z.infer<typeof SignInInput>;

export const PasswordResetInput = z.object({ email: Email });
export type PasswordResetInput = z.infer<typeof PasswordResetInput>;

export const PasswordResetConfirmInput = z.object({
  token: z
    .string({ error: 'The link is missing its token' })
    .min(20, { error: 'The link is incomplete; open it from the e-mail again' })
    .max(200, { error: 'The link is not valid' }),
  password: NewPassword,
});
export type PasswordResetConfirmInput = z.infer<typeof PasswordResetConfirmInput>;

export const ChangePasswordInput = z.object({
  currentPassword: z
    .string({ error: 'Enter your current password' })
    .min(1, { error: 'Enter your current password' })
    .max(200),
  newPassword: NewPassword,
});
export type ChangePasswordInput = z.infer<typeof ChangePasswordInput>;

export const UpdateAccountInput = z.object({ name: DisplayName });
export type UpdateAccountInput = z.infer<typeof UpdateAccountInput>;

/** The signed-in user as every API answer shows it. */
export const User = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: Role,
});
export type User = z.infer<typeof User>;

export const UserResponse = z.object({ user: User });
export type UserResponse = z.infer<typeof UserResponse>;

/** `GET /api/auth/session`: who is signed in, or null (never a 401, so a visitor's page stays quiet). */
export const SessionResponse = z.object({ user: User.nullable() });
export type SessionResponse = z.infer<typeof SessionResponse>;

export const CsrfResponse = z.object({ token: z.string() });
export type CsrfResponse = z.infer<typeof CsrfResponse>;

export const OkResponse = z.object({ ok: z.literal(true) });
export type OkResponse = z.infer<typeof OkResponse>;
