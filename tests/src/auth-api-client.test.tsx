import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { ApiError, apiFetch, resetCsrfToken } from '../../src/lib/api-client';

type Seen = { url: string; method: string; headers: Record<string, string> };
let seen: Seen[];
let csrfIssued: number;
let acceptToken: string;

beforeEach(() => {
  resetCsrfToken();
  seen = [];
  csrfIssued = 0;
  acceptToken = 'token-1';
  vi.stubGlobal('fetch', async (url: string, init: RequestInit = {}) => {
    seen.push({ url, method: init.method ?? 'GET', headers: (init.headers ?? {}) as Record<string, string> });
    if (url === '/api/auth/csrf')
      return new Response(JSON.stringify({ token: `token-${++csrfIssued}` }), { status: 200 });
    const sent = (init.headers as Record<string, string> | undefined)?.['x-csrf-token'];
    if (init.method && init.method !== 'GET' && sent !== acceptToken) {
      return new Response(
        JSON.stringify({ error: { message: 'Missing or invalid CSRF token; reload the page and try again' } }),
        { status: 403 },
      );
    }
    return new Response(JSON.stringify({ ok: true }), { status: 200 });
  });
});
afterEach(() => vi.unstubAllGlobals());

const Ok = z.object({ ok: z.literal(true) });

describe('apiFetch and the CSRF token', () => {
  it('fetches the token only when a state-changing request needs it, once, and sends it', async () => {
    await apiFetch('/api/x', Ok);
    expect(seen.map((s) => s.url)).toEqual(['/api/x']);
    expect(seen[0]!.headers['x-csrf-token']).toBeUndefined();
    await apiFetch('/api/y', Ok, { method: 'POST', body: { a: 1 } });
    await apiFetch('/api/z', Ok, { method: 'DELETE' });
    expect(seen.map((s) => s.url)).toEqual(['/api/x', '/api/auth/csrf', '/api/y', '/api/z']);
    expect(seen[2]!.headers).toEqual({ 'content-type': 'application/json', 'x-csrf-token': 'token-1' });
  });

  it('on a CSRF refusal fetches a new token and retries once', async () => {
    await apiFetch('/api/y', Ok, { method: 'POST' });
    acceptToken = 'token-2'; // the server's session changed (signed in elsewhere, restarted)
    await expect(apiFetch('/api/y', Ok, { method: 'POST' })).resolves.toEqual({ ok: true });
    expect(seen.filter((s) => s.url === '/api/auth/csrf')).toHaveLength(2);
    acceptToken = 'never';
    const err = await apiFetch('/api/y', Ok, { method: 'POST' }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect((err as ApiError).status).toBe(403);
    expect(seen.filter((s) => s.url === '/api/y')).toHaveLength(5); // 1 + (1 + retry) + (1 + retry)
  });

  it('resetCsrfToken makes the next state-changing request fetch a fresh token (after sign-in or sign-out)', async () => {
    await apiFetch('/api/y', Ok, { method: 'POST' });
    resetCsrfToken();
    acceptToken = 'token-2';
    await apiFetch('/api/y', Ok, { method: 'POST' });
    expect(seen.filter((s) => s.url === '/api/y').map((s) => s.headers['x-csrf-token'])).toEqual([
      'token-1',
      'token-2',
    ]);
  });
});
