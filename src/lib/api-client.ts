import type { z } from 'zod';

/** An API failure with the server's status, message and (for 422) the field issues. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly issues?: unknown[],
  ) {
    super(message);
  }
}

type Options = { method?: string; body?: unknown; signal?: AbortSignal };

/** The one fetch wrapper: JSON in, JSON out, parsed with the shared schema. */
export async function apiFetch<T>(url: string, schema: z.ZodType<T>, opts: Options = {}): Promise<T> {
  const res = await fetch(url, {
    method: opts.method ?? 'GET',
    headers: opts.body === undefined ? {} : { 'content-type': 'application/json' },
    body: opts.body === undefined ? undefined : JSON.stringify(opts.body),
    credentials: 'same-origin',
    signal: opts.signal,
  });
  const text = await res.text();
  const data: unknown = text ? JSON.parse(text) : undefined;
  if (!res.ok) {
    const err = (data as { error?: { message?: string; issues?: unknown[] } } | undefined)?.error;
    throw new ApiError(res.status, err?.message ?? `Request failed (${res.status})`, err?.issues);
  }
  return schema.parse(data);
}
