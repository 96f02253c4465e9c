import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen } from '@testing-library/react';
import { renderAt } from './render';

// The client talks to a local stand-in for the health endpoint; server behaviour is tested in tests/server.
beforeEach(() => {
  vi.stubGlobal('fetch', async () => new Response(JSON.stringify({ ok: true, db: 'up' }), { status: 200 }));
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('app shell', () => {
  it('shows the product name, the navigation and the standing caution', async () => {
    renderAt('/');
    expect(await screen.findByRole('heading', { level: 1 })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Loadline' })).toBeTruthy();
    expect(screen.getByRole('navigation', { name: 'Main' })).toBeTruthy();
    expect(screen.getByText(/does not replace/)).toBeTruthy();
    expect(await screen.findByText('Registry online')).toBeTruthy();
  });

  it('an unknown address renders the 404 screen inside the shell', async () => {
    renderAt('/no/such/screen');
    expect(await screen.findByRole('heading', { name: 'Page not found' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Loadline' })).toBeTruthy();
  });

  it('the sign-in route has its screen', async () => {
    renderAt('/sign-in');
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeTruthy();
  });
});
