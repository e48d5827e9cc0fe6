import { z } from 'zod';
import { DisplayName, Id, IsoDateTime } from './common';

export const Email = z
  .string()
  .trim()
  .toLowerCase()
  .max(254)
  .pipe(z.email({ message: 'expected an e-mail address' }));

/** Length over composition rules (NIST SP 800-63B §5.1.1.2): at least 10, at most 256 chars. */
export const Password = z
  .string()
  .min(10, 'use at least 10 characters')
  .max(256, 'use at most 256 characters');

export const PersonName = DisplayName(80);

export const SignUpInput = z.object({
  email: Email,
  password: Password,
  name: PersonName,
  /** Joining through an invite link while creating the account. */
  inviteToken: z.string().min(20).max(128).optional(),
});
export type SignUpInput = z.infer<typeof SignUpInput>;

export const SignInInput = z.object({ email: Email, password: z.string().min(1).max(256) });
export type SignInInput = z.infer<typeof SignInInput>;

export const ResetRequestInput = z.object({ email: Email });
export type ResetRequestInput = z.infer<typeof ResetRequestInput>;

export const ResetConfirmInput = z.object({
  token: z.string().min(20).max(128),
  password: Password,
});
export type ResetConfirmInput = z.infer<typeof ResetConfirmInput>;

export const ChangePasswordInput = z.object({
  currentPassword: z.string().min(1).max(256),
  newPassword: Password,
});
export type ChangePasswordInput = z.infer<typeof ChangePasswordInput>;

/** Settings a user changes about themselves. */
export const UpdateMeInput = z
  .object({
    name: PersonName.optional(),
    /** Mail when someone comments on my flight or replies to me. Mentions and invites always mail. */
    commentMail: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'nothing to change');
export type UpdateMeInput = z.infer<typeof UpdateMeInput>;

export const Me = z.object({
  id: Id,
  email: z.string(),
  name: z.string(),
  commentMail: z.boolean(),
  createdAt: IsoDateTime,
  teams: z.array(
    z.object({
      id: Id,
      name: z.string(),
      role: z.enum(['owner', 'tuner', 'pilot', 'coach', 'viewer']),
    }),
  ),
});
export type Me = z.infer<typeof Me>;

/** Answer of sign-up / sign-in / me. */
export const MeResponse = z.object({ user: Me });
export type MeResponse = z.infer<typeof MeResponse>;

/** `GET /api/auth/me`: who is signed in on this device; `user` is null for nobody. */
export const SessionResponse = z.object({ user: Me.nullable() });
export type SessionResponse = z.infer<typeof SessionResponse>;

/** Answer of routes that only acknowledge (reset request, sign-out). */
export const OkResponse = z.object({ ok: z.literal(true), message: z.string().optional() });
export type OkResponse = z.infer<typeof OkResponse>;
