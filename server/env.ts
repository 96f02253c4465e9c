import { z } from 'zod';

/**
 * The only module that reads `process.env`. Everything configurable is listed here,
 * parsed with zod, and fails fast with one clear line naming the bad variable.
 */
const bool = z
  .enum(['1', '0', 'true', 'false', 'yes', 'no'])
  .transform((v) => v === '1' || v === 'true' || v === 'yes');

const EnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  /** Set by the scripts (our own PostgreSQL) or by the operator (an external server). */
  DATABASE_URL: z.string().url().optional(),
  /** Port of the project's own PostgreSQL cluster on 127.0.0.1. */
  LOADLINE_PG_PORT: z.coerce.number().int().min(1024).max(65535).default(54329),
  /** Where the built client is served from ('built') or Vite middleware ('vite'). */
  CLIENT_MODE: z.enum(['built', 'vite', 'none']).default('built'),
  SESSION_SECRET: z.string().min(32).optional(),
  COOKIE_SECURE: bool.optional(),
  SESSION_IDLE_MINUTES: z.coerce.number().int().min(1).default(30),
  SESSION_ABSOLUTE_HOURS: z.coerce.number().int().min(1).default(12),
  /** Sign-in and password-reset attempts allowed per account and per address in each window. */
  AUTH_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
  AUTH_RATE_WINDOW_MINUTES: z.coerce.number().int().min(1).default(15),
  /** Public base URL used in e-mailed links. */
  APP_URL: z.string().url().optional(),
  SMTP_HOST: z.string().optional(),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).optional(),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default('Loadline <no-reply@loadline.test>'),
  LOG_LEVEL: z.enum(['silent', 'error', 'info']).default('info'),
});

export type Env = z.infer<typeof EnvSchema>;

export class EnvError extends Error {}

export function parseEnv(source: Record<string, string | undefined>): Env {
  const result = EnvSchema.safeParse(source);
  if (!result.success) {
    const first = result.error.issues[0];
    const name = first?.path.join('.') ?? 'environment';
    throw new EnvError(`Invalid environment variable ${name}: ${first?.message ?? 'invalid'}`);
  }
  const env = result.data;
  if (env.NODE_ENV === 'production' && !env.SESSION_SECRET) {
    throw new EnvError('Invalid environment variable SESSION_SECRET: required in production (32+ characters)');
  }
  return env;
}

let cached: Env | undefined;

/** The process environment, parsed once. */
export function env(): Env {
  cached ??= parseEnv(process.env);
  return cached;
}

/** A copy of the environment for a child process, with overrides. */
export function childEnv(overrides: Record<string, string>): NodeJS.ProcessEnv {
  return { ...process.env, ...overrides };
}
