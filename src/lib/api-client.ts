import type { z } from 'zod';
import { CsrfResponseSchema } from '../../shared/auth';

/** An API failure with the server's status, message and (for 422) the field issues. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly issues?: unknown[],
    /** The whole JSON answer, for endpoints whose error answer carries more than the message (e.g. an upload report). */
    readonly body?: unknown,
  ) {
    super(message);
  }
}

type Options = { method?: string; body?: unknown; signal?: AbortSignal };

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);
let csrf: Promise<string> | null = null;

/** The CSRF token for state-changing requests: fetched on first need, then kept. */
function csrfToken(): Promise<string> {
  csrf ??= fetch('/api/auth/csrf', { credentials: 'same-origin' })
    .then(async (r) => {
      if (!r.ok) throw new ApiError(r.status, 'The server did not hand out a form token; reload the page');
      return CsrfResponseSchema.parse(await r.json()).token;
    })
    .catch((e: unknown) => {
      csrf = null;
      throw e;
    });
  return csrf;
}

/** Forgets the CSRF token; the server binds it to the session, so call this after sign-in and sign-out. */
export function resetCsrfToken(): void {
  csrf = null;
}

async function send(url: string, method: string, opts: Options): Promise<Response> {
  const headers: Record<string, string> = {};
  const isForm = typeof FormData !== 'undefined' && opts.body instanceof FormData;
  if (opts.body !== undefined && !isForm) headers['content-type'] = 'application/json';
  if (!SAFE.has(method)) headers['x-csrf-token'] = await csrfToken();
  return fetch(url, {
    method,
    headers,
    body: opts.body === undefined ? undefined : isForm ? (opts.body as FormData) : JSON.stringify(opts.body),
    credentials: 'same-origin',
    signal: opts.signal,
  });
}

async function readError(res: Response): Promise<ApiError> {
  const text = await res.text();
  let err: { message?: string; issues?: unknown[] } | undefined;
  let body: unknown;
  try {
    body = JSON.parse(text);
    err = (body as { error?: typeof err } | undefined)?.error;
  } catch {
    err = undefined;
  }
  return new ApiError(res.status, err?.message ?? `Request failed (${res.status})`, err?.issues, body);
}

/**
 * The one fetch wrapper: JSON in (or FormData), JSON out, parsed with the shared schema.
 * State-changing requests carry the CSRF header; a 403 for a stale token is retried once with a fresh one.
 */
export async function apiFetch<T>(url: string, schema: z.ZodType<T>, opts: Options = {}): Promise<T> {
  const method = (opts.method ?? 'GET').toUpperCase();
  let res = await send(url, method, opts);
  if (res.status === 403 && !SAFE.has(method)) {
    const err = await readError(res.clone());
    if (/CSRF/i.test(err.message)) {
      resetCsrfToken();
      res = await send(url, method, opts);
    }
  }
  if (!res.ok) throw await readError(res);
  const text = await res.text();
  const data: unknown = text ? JSON.parse(text) : undefined;
  return schema.parse(data);
}
