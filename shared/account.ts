import { z } from 'zod';
import { ROLES } from './roles';
import { SessionUserSchema } from './auth';

/** Account management shared by client and server: invitations, password reset, user lists. */
export const AUTH_TOKEN_PURPOSES = ['invite', 'reset'] as const;
export type AuthTokenPurpose = (typeof AUTH_TOKEN_PURPOSES)[number];

/** Client pages the e-mailed links open (the client's paths.ts uses the same strings). */
export const ACCOUNT_LINK_PATHS = { acceptInvitation: '/accept-invitation', resetPassword: '/reset-password' } as const;

/** Length over composition rules (NIST SP 800-63B §3.1.1.2: at least 8; we ask 12, allow 200). */
export const PASSWORD_MIN = 12;
export const NewPasswordSchema = z
  .string()
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters`)
  .max(200, 'Use at most 200 characters');

const Email = z.string().trim().toLowerCase().email('Enter an e-mail address').max(254);
/** Tokens are 32 random bytes in base64url; anything else is refused before a lookup. */
const Token = z.string().regex(/^[A-Za-z0-9_-]{43}$/, 'This link is not valid');

export const InvitationInputSchema = z.object({
  email: Email,
  role: z.enum(ROLES),
  clinicId: z.number().int().positive().nullable().optional(),
});
export type InvitationInput = z.infer<typeof InvitationInputSchema>;

export const AcceptInvitationInputSchema = z.object({
  token: Token,
  name: z.string().trim().min(1, 'Enter your name').max(120),
  password: NewPasswordSchema,
});
export type AcceptInvitationInput = z.infer<typeof AcceptInvitationInputSchema>;

export const ForgotInputSchema = z.object({ email: Email });
export type ForgotInput = z.infer<typeof ForgotInputSchema>;

export const ResetInputSchema = z.object({ token: Token, password: NewPasswordSchema });
export type ResetInput = z.infer<typeof ResetInputSchema>;

export const ACCOUNT_STATES = ['invited', 'active', 'deactivated'] as const;

export const AccountSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  clinicId: z.number().int().nullable(),
  state: z.enum(ACCOUNT_STATES),
});
export type Account = z.infer<typeof AccountSchema>;

export const InvitationResponseSchema = z.object({
  account: AccountSchema,
  expiresAt: z.string(),
  /** False when the invitation was saved but the mail server refused it; resend later. */
  mailSent: z.boolean(),
});
export const AccountsResponseSchema = z.object({ accounts: z.array(AccountSchema) });
export const AccountResponseSchema = z.object({ account: AccountSchema });

export const OutboxMessageSchema = z.object({
  id: z.number().int(),
  to: z.array(z.string()),
  from: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  links: z.array(z.string()),
  receivedAt: z.string(),
});
export const OutboxResponseSchema = z.object({ messages: z.array(OutboxMessageSchema) });
export type OutboxMessage = z.infer<typeof OutboxMessageSchema>;

/** GET /api/auth/me: the user (null on the client when signed out) and whether the dev Outbox exists for them. */
export const SessionResponseSchema = z.object({ user: SessionUserSchema, outbox: z.boolean().default(false) });
export type Session = { user: z.infer<typeof SessionUserSchema> | null; outbox: boolean };
