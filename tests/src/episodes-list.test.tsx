import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { fakeServer, renderApp, type Call } from './auth-helpers';
import { listItem } from './episodes-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const TOTAL = 60;

/** A caseload of 60 invented episodes, paged by the fake server from the query's limit and offset. */
function caseload() {
  return fakeServer({
    role: 'lead',
    extra: (c: Call) => {
      if (!c.url.startsWith('/api/episodes?')) return undefined;
      const q = new URLSearchParams(c.url.split('?')[1]);
      const limit = Number(q.get('limit'));
      const offset = Number(q.get('offset'));
      const ids = Array.from({ length: TOTAL }, (_, i) => i + 1).slice(offset, offset + limit);
      const items = ids.map((n) => listItem(n, n === 2 ? { status: 'discharged', firstStepPainChange: 1, latestFirstStepPain: 8 } : {}));
      return { status: 200, body: { items, total: TOTAL } };
    },
  });
}

const listCalls = (calls: Call[]) => calls.filter((c) => c.url.startsWith('/api/episodes?')).map((c) => new URLSearchParams(c.url.split('?')[1]));

describe('caseload list', () => {
  it('renders the rows of the first page with the pain change sign-corrected', async () => {
    const { calls } = caseload();
    renderApp('/episodes');
    const table = await screen.findByRole('table', { name: 'Episodes of your clinic' });
    const rows = within(table).getAllByRole('row').slice(1); // the header row first
    expect(rows).toHaveLength(25);
    expect(within(rows[0]!).getByRole('link', { name: 'HB-0001' }).getAttribute('href')).toBe('/episodes/1');
    // The server sends latest minus baseline (−3); the list reads "+3" = three points less pain.
    expect(within(rows[0]!).getByText('+3')).toBeTruthy();
    expect(within(rows[1]!).getByText('−1')).toBeTruthy();
    expect(within(rows[1]!).getByText('Discharged')).toBeTruthy();
    expect(screen.getByText('Rows 1–25 of 60')).toBeTruthy();
    expect(screen.getByText(/not treatment advice/)).toBeTruthy();
    const first = listCalls(calls)[0]!;
    expect(Object.fromEntries(first)).toEqual({ limit: '25', offset: '0', sort: 'startDate', order: 'desc' });
  });

  it('pages, sorts, filters and searches through the server, keeping the state in the address', async () => {
    const { calls } = caseload();
    const { router } = renderApp('/episodes');
    const user = userEvent.setup();
    await screen.findByRole('table', { name: 'Episodes of your clinic' });
    expect(screen.getByRole('button', { name: 'Previous' }).hasAttribute('disabled')).toBe(true);

    await user.click(screen.getByRole('button', { name: 'Next' }));
    expect(await screen.findByText('Rows 26–50 of 60')).toBeTruthy();
    expect(await screen.findByRole('link', { name: 'HB-0026' })).toBeTruthy();
    expect(router.state.location.search).toBe('?page=2');
    await user.click(screen.getByRole('button', { name: 'Next' }));
    expect(await screen.findByText('Rows 51–60 of 60')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Next' }).hasAttribute('disabled')).toBe(true);

    await user.click(screen.getByRole('button', { name: /Weeks in care/ }));
    await waitFor(() => expect(router.state.location.search).toBe('?sort=weeksInCare'));
    const weeksHeader = screen.getByRole('columnheader', { name: /Weeks in care/ });
    expect(weeksHeader.getAttribute('aria-sort')).toBe('descending');

    await user.selectOptions(screen.getByLabelText('Status'), 'lost');
    await user.type(screen.getByLabelText('Find by episode reference'), 'HB-00');
    await user.click(screen.getByRole('button', { name: 'Search' }));
    await waitFor(() => expect(router.state.location.search).toBe('?sort=weeksInCare&status=lost&q=HB-00'));
    const last = listCalls(calls).at(-1)!;
    expect(Object.fromEntries(last)).toEqual({ limit: '25', offset: '0', sort: 'weeksInCare', order: 'desc', status: 'lost', q: 'HB-00' });
  });

  it('restores the state from the address and says when nothing matches', async () => {
    const { calls } = fakeServer({
      role: 'clinician',
      extra: (c) => (c.url.startsWith('/api/episodes?') ? { status: 200, body: { items: [], total: 0 } } : undefined),
    });
    renderApp('/episodes?page=3&sort=reference&order=asc&status=open&q=ZZ');
    expect(await screen.findByText('No episode matches')).toBeTruthy();
    expect(Object.fromEntries(listCalls(calls)[0]!)).toEqual({ limit: '25', offset: '50', sort: 'reference', order: 'asc', status: 'open', q: 'ZZ' });
    expect((screen.getByLabelText('Status') as HTMLSelectElement).value).toBe('open');
  });
});
