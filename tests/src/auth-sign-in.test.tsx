import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { fakeServer, renderApp } from './auth-helpers';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('sign-in screen', () => {
  it('shows field errors from the shared schema and sends nothing', async () => {
    const { calls } = fakeServer();
    renderApp('/sign-in');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter an e-mail address')).toBeTruthy();
    expect(screen.getByText('Enter your password')).toBeTruthy();
    expect(screen.getByLabelText('E-mail').getAttribute('aria-invalid')).toBe('true');
    await user.type(screen.getByLabelText('E-mail'), 'not-an-address');
    await user.type(screen.getByLabelText('Password'), 'x');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter an e-mail address')).toBeTruthy();
    expect(screen.queryByText('Enter your password')).toBeNull();
    expect(calls.some((c) => c.url === '/api/auth/login')).toBe(false);
    expect(screen.getByRole('link', { name: 'Forgot password?' }).getAttribute('href')).toBe('/forgot-password');
  });

  it("shows the server's refusal and sends the CSRF header with the sign-in", async () => {
    const { calls } = fakeServer({
      extra: (c) =>
        c.url === '/api/auth/login'
          ? { status: 401, body: { error: { message: 'E-mail or password is not right' } } }
          : undefined,
    });
    renderApp('/sign-in');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('E-mail'), 'Someone@Example.test');
    await user.type(screen.getByLabelText('Password'), 'wrong-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect((await screen.findByRole('alert')).textContent).toMatch('E-mail or password is not right');
    const login = calls.find((c) => c.url === '/api/auth/login')!;
    expect(login.method).toBe('POST');
    expect(login.headers['x-csrf-token']).toMatch(/^csrf-/);
    expect(login.body).toEqual({ email: 'someone@example.test', password: 'wrong-password' });
  });

  it('after signing in goes back to the page the person came from, showing their name and role', async () => {
    const server = fakeServer({
      outbox: true,
      extra: (c) => {
        if (c.url !== '/api/auth/login') return undefined;
        server.state.role = 'steward';
        return {
          status: 200,
          body: {
            user: { id: 7, email: 'steward@example.test', name: 'Demo steward', role: 'steward', clinicId: null },
          },
        };
      },
    });
    const { router } = renderApp('/sign-in?next=%2Foutbox');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('E-mail'), 'steward@example.test');
    await user.type(screen.getByLabelText('Password'), 'the-right-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('heading', { name: 'Outbox' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/outbox');
    expect(screen.getByText('Demo steward')).toBeTruthy();
    expect(screen.getByText('Registry steward')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Sign out' })).toBeTruthy();
  });

  it('refuses a "next" that leaves the app', async () => {
    const server = fakeServer({
      extra: (c) => {
        if (c.url !== '/api/auth/login') return undefined;
        server.state.role = 'clinician';
        return {
          status: 200,
          body: { user: { id: 7, email: 'c@example.test', name: 'C', role: 'clinician', clinicId: 3 } },
        };
      },
    });
    const { router } = renderApp('/sign-in?next=%2F%2Fevil.example%2F');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('E-mail'), 'c@example.test');
    await user.type(screen.getByLabelText('Password'), 'pw');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/'));
  });
});
