import { configure, render } from '@testing-library/react';
import { QueryClientProvider } from '@tanstack/react-query';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { vi } from 'vitest';
import { routes } from '../../src/app/routes';
import { createQueryClient } from '../../src/lib/query-client';
import { resetCsrfToken } from '../../src/lib/api-client';
import type { Role } from '../../shared/roles';

// The first screen of a file loads its lazy route module cold; on a busy machine that takes more than
// Testing Library's default second.
configure({ asyncUtilTimeout: 5000 });

/** A recorded request of the client. */
export type Call = { url: string; method: string; headers: Record<string, string>; body: unknown };

type Reply = { status: number; body?: unknown };
type Route = (call: Call) => Reply | undefined;

export const userOf = (role: Role) => ({
  id: 7,
  email: `${role}@example.test`,
  name: `Demo ${role}`,
  role,
  clinicId: role === 'lead' || role === 'clinician' ? 3 : null,
});

/**
 * A stand-in for the server's HTTP answers (the server itself is tested in tests/server): `me` says
 * who is signed in; `extra` answers anything else first. Every call is recorded.
 */
export function fakeServer(opts: { role?: Role | null; outbox?: boolean; extra?: Route } = {}) {
  const calls: Call[] = [];
  const state = { role: opts.role ?? null };
  const json = (r: Reply) => new Response(r.body === undefined ? null : JSON.stringify(r.body), { status: r.status });
  vi.stubGlobal('fetch', async (input: string, init: RequestInit = {}) => {
    const call: Call = {
      url: String(input),
      method: (init.method ?? 'GET').toUpperCase(),
      headers: (init.headers ?? {}) as Record<string, string>,
      body: typeof init.body === 'string' ? JSON.parse(init.body) : init.body,
    };
    calls.push(call);
    const custom = opts.extra?.(call);
    if (custom) return json(custom);
    if (call.url === '/api/health') return json({ status: 200, body: { ok: true, db: 'up' } });
    if (call.url === '/api/auth/csrf') return json({ status: 200, body: { token: `csrf-${calls.length}` } });
    if (call.url === '/api/auth/me') {
      return state.role
        ? json({ status: 200, body: { user: userOf(state.role), outbox: opts.outbox ?? false } })
        : json({ status: 401, body: { error: { message: 'Sign in to continue' } } });
    }
    if (call.url === '/api/dev/outbox') return json({ status: 200, body: { messages: [] } });
    return json({ status: 404, body: { error: { message: 'No such API route' } } });
  });
  return { calls, state };
}

/** The real route table in a memory router with the app's QueryClient behaviour (401 handling). */
export function renderApp(url: string) {
  resetCsrfToken();
  const client = createQueryClient({ retry: false });
  const router = createMemoryRouter(routes, { initialEntries: [url] });
  const view = render(
    <QueryClientProvider client={client}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { ...view, router, client };
}
