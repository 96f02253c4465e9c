import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { isValidElement, type ReactElement } from 'react';
import type { RouteObject } from 'react-router-dom';
import { navigation } from '../../src/config/navigation';
import { routes } from '../../src/app/routes';
import { RequireRole } from '../../src/features/auth';
import { ROLES, type Role } from '../../shared/roles';
import { fakeServer, renderApp, userOf } from './auth-helpers';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const mainNav = () => within(screen.getByRole('navigation', { name: 'Main' }));

describe('navigation by role', () => {
  const cases = [...ROLES.map((role) => ({ who: role, role })), { who: 'signed out', role: null }];
  it.each(cases)('shows $who only the entries they may use', async ({ role }) => {
    fakeServer({ role, outbox: role === 'steward' });
    renderApp('/');
    if (role) expect(await screen.findByText(userOf(role).name)).toBeTruthy();
    else expect(await screen.findByRole('link', { name: 'Sign in' })).toBeTruthy();
    for (const item of navigation) {
      const may = !item.roles || (role !== null && item.roles.includes(role));
      const link = mainNav().queryByRole('link', { name: item.label });
      expect(Boolean(link), `${item.label} for ${role ?? 'signed out'}`).toBe(may);
    }
  });

  it('hides the development Outbox when the server says it does not exist', async () => {
    fakeServer({ role: 'steward', outbox: false });
    renderApp('/');
    await screen.findByText(userOf('steward').name);
    expect(mainNav().queryByRole('link', { name: 'Outbox' })).toBeNull();
  });

  it('no entry is shown to a role its route guard refuses', () => {
    const guardOf = new Map<string, readonly Role[]>();
    const walk = (list: RouteObject[], inherited?: readonly Role[]) => {
      for (const r of list) {
        const el = r.element as ReactElement<{ roles?: readonly Role[] }> | undefined;
        const own = isValidElement(el) && el.type === RequireRole ? el.props.roles : inherited;
        if (r.path && own) guardOf.set(r.path, own);
        if (r.children) walk(r.children, own);
      }
    };
    walk(routes);
    for (const item of navigation.filter((i) => i.roles)) {
      const guard = guardOf.get(item.to);
      expect(guard, `${item.to} has a RequireRole guard`).toBeTruthy();
      for (const r of item.roles!) expect(guard).toContain(r);
    }
  });

  it('a route the role may not use redirects to the overview with a message', async () => {
    fakeServer({ role: 'clinician' });
    const { router } = renderApp('/outbox');
    expect(await screen.findByText('That screen is for registry stewards only.')).toBeTruthy();
    expect(router.state.location.pathname).toBe('/');
  });

  it('signed out, a guarded route sends to sign-in and back afterwards', async () => {
    const server = fakeServer({
      outbox: true,
      extra: (c) => {
        if (c.url !== '/api/auth/login') return undefined;
        server.state.role = 'steward';
        return { status: 200, body: { user: userOf('steward') } };
      },
    });
    const { router } = renderApp('/outbox');
    await screen.findByRole('heading', { name: 'Sign in' });
    expect(router.state.location.pathname + router.state.location.search).toBe('/sign-in?next=%2Foutbox');
    const user = userEvent.setup();
    await user.type(screen.getByLabelText('E-mail'), 'steward@example.test');
    await user.type(screen.getByLabelText('Password'), 'pw');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('heading', { name: 'Outbox' })).toBeTruthy();
  });

  it('a 401 from any request ends the session in the client and sends to sign-in, returning afterwards', async () => {
    let expired = false;
    const server = fakeServer({
      role: 'steward',
      outbox: true,
      extra: (c) => {
        if (c.url === '/api/dev/outbox' && expired)
          return { status: 401, body: { error: { message: 'Sign in to continue' } } };
        if (c.url === '/api/auth/login') {
          expired = false;
          server.state.role = 'steward';
          return { status: 200, body: { user: userOf('steward') } };
        }
        return undefined;
      },
    });
    const { router } = renderApp('/outbox');
    await screen.findByText('No e-mail yet');
    // the session ends on the server; the next request of the screen answers 401
    expired = true;
    server.state.role = null;
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Check again' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(router.state.location.search).toBe('?next=%2Foutbox');
    await user.type(await screen.findByLabelText('E-mail'), 'steward@example.test');
    await user.type(screen.getByLabelText('Password'), 'pw');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('heading', { name: 'Outbox' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/outbox');
  });

  it('signing out calls the server, forgets the user and shows the sign-in screen', async () => {
    const server = fakeServer({
      role: 'lead',
      extra: (c) => {
        if (c.url !== '/api/auth/logout') return undefined;
        server.state.role = null;
        return { status: 204 };
      },
    });
    const { router } = renderApp('/');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Sign out' }));
    await screen.findByRole('heading', { name: 'Sign in' });
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(screen.queryByText(userOf('lead').name)).toBeNull();
    const logout = server.calls.find((c) => c.url === '/api/auth/logout')!;
    expect(logout.headers['x-csrf-token']).toMatch(/^csrf-/);
  });
});
