import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { fakeServer, renderApp, type Call } from './auth-helpers';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const item = (over: Record<string, unknown> = {}) => ({
  episodeId: 41,
  reference: 'HX-0041',
  startDate: '2026-01-05',
  timepoint: 'week12',
  state: 'closing',
  opensOn: '2026-03-16',
  closesOn: '2026-04-27',
  daysLeft: 3,
  linkExpiresAt: null,
  ...over,
});

function server(extra?: (c: Call) => { status: number; body?: unknown } | undefined) {
  return (c: Call) =>
    extra?.(c) ??
    (c.url.startsWith('/api/follow-ups?')
      ? {
          status: 200,
          body: {
            items: [
              item(),
              item({ episodeId: 42, reference: 'HX-0042', state: 'due', timepoint: 'week6', daysLeft: 12 }),
            ],
            total: 2,
            today: '2026-04-24',
          },
        }
      : c.url === '/api/me/preferences'
        ? {
            status: 200,
            body: { digestOptOut: c.method === 'PATCH' ? (c.body as { digestOptOut: boolean }).digestOptOut : false },
          }
        : c.url === '/api/follow-ups/completeness'
          ? {
              status: 200,
              body: {
                from: '2025-04-24',
                to: '2026-04-23',
                target: 0.8,
                minCell: 10,
                timepoints: [
                  {
                    timepoint: 'week6',
                    clinic: { expected: 40, completed: 30, share: 0.75 },
                    registry: { expected: 400, completed: 340, share: 0.85 },
                  },
                  {
                    timepoint: 'week12',
                    clinic: { expected: 4, completed: 2, share: 0.5 },
                    registry: { expected: 300, completed: 240, share: 0.8 },
                  },
                  {
                    timepoint: 'week26',
                    clinic: { expected: 0, completed: 0, share: null },
                    registry: { expected: 100, completed: 60, share: 0.6 },
                  },
                ],
              },
            }
          : c.url === '/api/follow-ups/lost-proposals'
            ? {
                status: 200,
                body: {
                  items: [
                    {
                      episodeId: 9,
                      reference: 'HX-0009',
                      startDate: '2025-06-01',
                      lastAssessedOn: '2025-07-01',
                      daysWithoutAssessment: 297,
                      version: 4,
                    },
                  ],
                  total: 1,
                },
              }
            : undefined);
}

describe('follow-ups screen', () => {
  it('lists the due follow-ups with a link to the record form, sorted by the server on request', async () => {
    const { calls } = fakeServer({ role: 'clinician', extra: server() });
    renderApp('/follow-ups');
    const table = await screen.findByRole('table', { name: 'Follow-ups of your clinic' });
    expect(within(table).getByText('Closes within a week')).toBeTruthy();
    const record = within(table).getAllByRole('link', { name: /Record scores/ })[0]!;
    expect(record.getAttribute('href')).toBe('/episodes/41/follow-up?timepoint=week12');
    expect(screen.queryByText(/Follow-ups recorded, last 12 months/)).toBeNull(); // lead only
    await userEvent.setup().click(within(table).getByRole('button', { name: /Episode/ }));
    await waitFor(() => expect(calls.some((c) => c.url.includes('sort=reference'))).toBe(true));
  });

  it('makes a single-use patient link and shows it with a QR code', async () => {
    const url = 'http://127.0.0.1/report/abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQ';
    const { calls } = fakeServer({
      role: 'clinician',
      extra: server((c) =>
        c.url === '/api/episodes/41/self-report-links'
          ? { status: 201, body: { url, expiresAt: '2026-05-08T10:00:00.000Z' } }
          : undefined,
      ),
    });
    renderApp('/follow-ups');
    const user = userEvent.setup();
    const table = await screen.findByRole('table', { name: 'Follow-ups of your clinic' });
    await user.click(within(table).getByRole('button', { name: /Patient link for HX-0041/ }));
    await user.click(await screen.findByRole('button', { name: 'Make the link' }));
    expect((await screen.findByRole('link', { name: url })).getAttribute('href')).toBe(url);
    const post = calls.find((c) => c.url === '/api/episodes/41/self-report-links')!;
    expect(post).toMatchObject({ method: 'POST', body: { timepoint: 'week12' } });
    expect(post.headers['x-csrf-token']).toMatch(/^csrf-/);
    const qr = await screen.findByRole('img', { name: /QR code of the patient link/ });
    expect(decodeURIComponent(qr.getAttribute('src')!)).toMatch(/^data:image\/svg\+xml;charset=utf-8,<svg/);
    expect(screen.getByText(/Works once, until 8 May 2026/)).toBeTruthy();
  });

  it('turns the morning e-mail off for the signed-in person', async () => {
    const { calls } = fakeServer({ role: 'clinician', extra: server() });
    renderApp('/follow-ups');
    const toggle = await screen.findByRole('switch', { name: /Morning e-mail/ });
    expect((toggle as HTMLInputElement).checked).toBe(true);
    await userEvent.setup().click(toggle);
    await waitFor(() => expect((toggle as HTMLInputElement).checked).toBe(false));
    expect(calls.find((c) => c.method === 'PATCH' && c.url === '/api/me/preferences')?.body).toEqual({
      digestOptOut: true,
    });
  });

  it('shows a lead the completeness against the target and lets them confirm a lost proposal with its version', async () => {
    const { calls } = fakeServer({
      role: 'lead',
      extra: server((c) =>
        c.url === '/api/episodes/9' && c.method === 'PATCH'
          ? { status: 409, body: { error: { message: 'changed by someone else' } } }
          : undefined,
      ),
    });
    renderApp('/follow-ups');
    const table = await screen.findByRole('table', { name: 'Follow-up completeness by timepoint' });
    expect(within(table).getByText('75%')).toBeTruthy();
    expect(within(table).getByText('few episodes: read with care')).toBeTruthy();
    expect(screen.getByRole('img', { name: /Completeness against the 80% target/ })).toBeTruthy();
    expect(screen.getByText(/common-practice level/)).toBeTruthy();
    const lost = (await screen.findByRole('heading', { name: 'No news for 26 weeks' })).closest('section')!;
    await userEvent
      .setup()
      .click(await within(lost).findByRole('button', { name: /Mark as lost to follow-up: HX-0009/ }));
    await waitFor(() =>
      expect(calls.find((c) => c.url === '/api/episodes/9')?.body).toEqual({ status: 'lost', version: 4 }),
    );
    expect((await screen.findByText('The episode was not changed')).closest('[role="alert"]')).toBeTruthy();
  });
});
