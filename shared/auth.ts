import { z } from 'zod';
import { ROLES } from './roles';

export const SessionUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  clinicId: z.number().int().nullable(),
});
export type SessionUser = z.infer<typeof SessionUserSchema>;

export const LoginInputSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter an e-mail address').max(254),
  password: z.string().min(1, 'Enter your password').max(200),
});
export type LoginInput = z.infer<typeof LoginInputSchema>;

export const MeResponseSchema = z.object({ user: SessionUserSchema });
export const CsrfResponseSchema = z.object({ token: z.string() });
