import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { fakeServer, renderApp, type Call } from './auth-helpers';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const report = (over: Record<string, unknown>) => ({ dryRun: true, accepted: 0, rejected: 0, errors: [], truncated: false, changes: null, uploadId: null, ...over });
const changes = { episodesCreated: 2, episodesUpdated: 0, assessmentsCreated: 4, assessmentsUpdated: 0, rowsUnchanged: 0 };
const pastUpload = { id: 5, clinicId: 3, fileName: 'january.csv', rowCount: 40, accepted: 40, rejected: 0, status: 'committed', createdAt: '2026-02-01T09:30:00.000Z' };

function server(answer: (c: Call) => { status: number; body: unknown }) {
  return fakeServer({
    role: 'clinician',
    extra: (c) => {
      if (c.url.startsWith('/api/uploads?')) return { status: 200, body: { items: [pastUpload], total: 1 } };
      if (c.url.startsWith('/api/uploads/episodes?')) return answer(c);
      return undefined;
    },
  });
}

const csv = (text: string, name = 'march.csv') => new File([text], name, { type: 'text/csv' });

describe('upload screen', () => {
  it('lists every row and column problem of a 422 answer and keeps Submit closed', async () => {
    const errors = [
      { row: 3, column: 'score_nprs_first_step', message: 'Pain on first steps in the morning runs from 0 to 10; got 12' },
      { row: 4, column: 'start_date', message: 'This date does not exist' },
      { row: 0, column: null, message: 'The header lacks the required column age_years' },
    ];
    const { calls } = server(() => ({ status: 422, body: { ...report({ accepted: 1, rejected: 2, errors }), error: { message: 'Some rows have problems' } } }));
    renderApp('/uploads');
    const user = userEvent.setup();
    expect((await screen.findByRole('link', { name: 'Download the template (CSV)' })).getAttribute('href')).toBe('/api/uploads/template.csv');
    expect(await screen.findByText('january.csv')).toBeTruthy(); // earlier uploads

    const submit = screen.getByRole('button', { name: 'Submit' });
    expect(submit.hasAttribute('disabled')).toBe(true);
    await user.upload(screen.getByLabelText('CSV file'), csv('episode_reference\nHB-1\n'));
    await user.click(screen.getByRole('button', { name: 'Check file' }));

    const table = await screen.findByRole('table', { name: 'Problems found in the file' });
    const rows = within(table).getAllByRole('row').slice(1).map((r) => within(r).getAllByRole('cell').map((td) => td.textContent));
    expect(rows).toEqual([
      ['3', 'score_nprs_first_step', 'Pain on first steps in the morning runs from 0 to 10; got 12'],
      ['4', 'start_date', 'This date does not exist'],
      ['Whole file', '–', 'The header lacks the required column age_years'],
    ]);
    expect(within(screen.getByText('Rows accepted').parentElement!).getByText('1')).toBeTruthy();
    expect(within(screen.getByText('Rows rejected').parentElement!).getByText('2')).toBeTruthy();
    expect(screen.getByText(/Nothing was saved/)).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Submit' }).hasAttribute('disabled')).toBe(true);

    const sent = calls.find((c) => c.url.startsWith('/api/uploads/episodes?'))!;
    expect(sent.url).toBe('/api/uploads/episodes?dryRun=1');
    expect(sent.body).toBeInstanceOf(FormData);
    expect(((sent.body as FormData).get('file') as File).name).toBe('march.csv');
    expect(sent.headers['x-csrf-token']).toMatch(/^csrf-/);
  });

  it('opens Submit only after a clean check of the chosen file, then saves it', async () => {
    const { calls } = server((c) =>
      c.url.endsWith('dryRun=1')
        ? { status: 200, body: report({ accepted: 4, changes }) }
        : { status: 200, body: report({ dryRun: false, accepted: 4, changes, uploadId: 9 }) },
    );
    renderApp('/uploads');
    const user = userEvent.setup();
    const input = await screen.findByLabelText('CSV file');
    await user.upload(input, csv('a\n'));
    await user.click(screen.getByRole('button', { name: 'Check file' }));
    expect(await screen.findByText(/Every row is valid/)).toBeTruthy();
    expect(screen.getByText(/Submitting would create 2 episodes and 4 assessments/)).toBeTruthy();
    await waitFor(() => expect(screen.getByRole('button', { name: 'Submit' }).hasAttribute('disabled')).toBe(false));

    // Choosing another file closes Submit again until that file is checked.
    await user.upload(input, csv('b\n', 'other.csv'));
    expect(screen.getByRole('button', { name: 'Submit' }).hasAttribute('disabled')).toBe(true);
    await user.click(screen.getByRole('button', { name: 'Check file' }));
    await waitFor(() => expect(screen.getByRole('button', { name: 'Submit' }).hasAttribute('disabled')).toBe(false));

    await user.click(screen.getByRole('button', { name: 'Submit' }));
    expect(await screen.findByText('The file was saved.')).toBeTruthy();
    const posts = calls.filter((c) => c.url.startsWith('/api/uploads/episodes?')).map((c) => c.url);
    expect(posts).toEqual(['/api/uploads/episodes?dryRun=1', '/api/uploads/episodes?dryRun=1', '/api/uploads/episodes?dryRun=0']);
    expect(screen.getByRole('button', { name: 'Submit' }).hasAttribute('disabled')).toBe(true);
  });
});
