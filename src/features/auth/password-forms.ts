import { z } from 'zod';
import { NewPasswordSchema } from '../../../shared/account';

/** The client's forms ask for the new password twice; the server schemas take it once. */
export const NewPasswordFormSchema = z
  .object({ password: NewPasswordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ' });
export type NewPasswordForm = z.infer<typeof NewPasswordFormSchema>;

export const AcceptFormSchema = z
  .object({
    name: z.string().trim().min(1, 'Enter your name').max(120),
    password: NewPasswordSchema,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ['confirm'], message: 'The two passwords differ' });
export type AcceptForm = z.infer<typeof AcceptFormSchema>;
