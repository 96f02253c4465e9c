import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { DEFAULT_RULES } from '../../shared/rules';
import { fakeServer, renderApp, type Call } from './auth-helpers';

// The console screens against a stand-in server (the API itself is tested in tests/server/admin-*.test.ts).
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const version = (v: number, threshold: number) => ({
  version: v,
  rules: { ...DEFAULT_RULES, recovery: { ...DEFAULT_RULES.recovery, threshold } },
  reason: v === 0 ? 'Shipped defaults' : 'Pilot',
  changedAt: v === 0 ? null : '2026-03-01T10:00:00.000Z',
  changedById: v === 0 ? null : 7,
  changedByName: v === 0 ? null : 'Demo steward',
  changes: v === 0 ? [] : [{ path: 'recovery.threshold', from: 2, to: threshold }],
});
const nprs = {
  id: 1, code: 'nprs-first-step', label: 'First-step pain (0–10)', unit: 'points', min: 0, max: 10, higherIsBetter: false, mcid: 2,
  mcidSource: 'Farrar 2001', bodyRegion: 'foot', retired: false, createdAt: '2026-01-01T00:00:00.000Z', scoreCount: 0, storedMin: null, storedMax: null,
};
const path = (c: Call) => c.url.split('?')[0];

describe('registry console', () => {
  it('a clinic lead sees Team, Code proposals and Audit trail only, and may invite clinicians only', async () => {
    const { calls } = fakeServer({
      role: 'lead',
      extra: (c) => (path(c) === '/api/admin/people' ? { status: 200, body: { items: [], total: 0 } } : undefined),
    });
    renderApp('/console/people');
    const tabs = await screen.findByRole('navigation', { name: 'Console sections' });
    expect(within(tabs).getAllByRole('link').map((l) => l.textContent)).toEqual(['Team', 'Code proposals', 'Audit trail']);
    const role = await screen.findByLabelText('Role');
    expect([...(role as HTMLSelectElement).options].map((o) => o.value)).toEqual(['clinician']);
    await waitFor(() => expect(calls.some((c) => c.url === '/api/admin/people?limit=25&offset=0')).toBe(true));
  });

  it('the rules form refuses a change without a reason, then sends the whole record with its base version', async () => {
    const { calls } = fakeServer({
      role: 'steward',
      extra: (c) => {
        if (path(c) === '/api/admin/rules' && c.method === 'GET') return { status: 200, body: { current: version(3, 2), history: [version(3, 2), version(0, 2)] } };
        if (path(c) === '/api/admin/rules' && c.method === 'PUT') return { status: 200, body: version(4, 1) };
        if (path(c) === '/api/admin/instruments') return { status: 200, body: { items: [nprs], total: 1 } };
        return undefined;
      },
    });
    renderApp('/console/rules');
    const threshold = await screen.findByLabelText('Recovery threshold');
    expect((threshold as HTMLInputElement).value).toBe('2');
    fireEvent.change(threshold, { target: { value: '1' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save as a new version' }));
    expect(await screen.findByText('Enter the reason for the change')).toBeTruthy();
    expect(calls.filter((c) => c.method === 'PUT')).toEqual([]);
    fireEvent.change(screen.getByLabelText(/Why this change/), { target: { value: 'Stricter recovery for the pilot' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save as a new version' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(1));
    const sent = calls.find((c) => c.method === 'PUT')!.body as { rules: typeof DEFAULT_RULES; reason: string; baseVersion: number };
    expect(sent).toEqual({ rules: { ...DEFAULT_RULES, recovery: { ...DEFAULT_RULES.recovery, threshold: 1 } }, reason: 'Stricter recovery for the pilot', baseVersion: 3 });
  });

  it('audit filters in the address reach the API, and the CSV link carries the same filter', async () => {
    const { calls } = fakeServer({
      role: 'steward',
      extra: (c) => {
        if (path(c) === '/api/audit') return { status: 200, body: { items: [], total: 0 } };
        if (path(c) === '/api/audit/facets') return { status: 200, body: { actions: ['update'], entities: ['clinic'] } };
        return undefined;
      },
    });
    renderApp('/console/audit?action=update&from=2026-03-01&page=2');
    await waitFor(() => expect(calls.some((c) => c.url === '/api/audit?limit=50&offset=50&action=update&from=2026-03-01')).toBe(true));
    const link = await screen.findByRole('link', { name: 'Download this view (CSV)' });
    expect(link.getAttribute('href')).toBe('/api/audit/export.csv?action=update&from=2026-03-01');
  });
});
