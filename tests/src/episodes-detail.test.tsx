import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { fakeServer, renderApp, type Call } from './auth-helpers';
import { assessment, episodeDetail, instruments, interventions } from './episodes-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function server(episode: (c: Call) => { status: number; body?: unknown } | undefined) {
  return fakeServer({
    role: 'clinician',
    extra: (c) => {
      if (c.url === '/api/instruments') return { status: 200, body: { items: instruments, total: instruments.length } };
      if (c.url === '/api/interventions') return { status: 200, body: { items: interventions, total: interventions.length } };
      if (c.url.startsWith('/api/episodes/12')) return episode(c);
      return undefined;
    },
  });
}

describe('episode detail', () => {
  it('shows the facts with BMI and band, and after a follow-up the change since the start with the MCID flag', async () => {
    const week6 = assessment(101, 'week6', '2026-02-16', 42, { 'nprs-first-step': 4, 'faam-adl': 60 });
    const { calls } = server((c) =>
      c.method === 'POST'
        ? { status: 201, body: episodeDetail({ assessments: [episodeDetail().assessments[0], week6] }) }
        : { status: 200, body: episodeDetail() },
    );
    renderApp('/episodes/12');
    const user = userEvent.setup();
    expect(await screen.findByRole('heading', { name: 'Episode HB-0012' })).toBeTruthy();
    expect(screen.getByText('26.4 kg/m²')).toBeTruthy();
    expect(screen.getByText('Overweight (25 to 29.9)')).toBeTruthy();
    expect(screen.getByText(/not treatment advice/)).toBeTruthy();

    const form = screen.getByRole('form', { name: 'Add a follow-up' });
    expect((within(form).getByLabelText(/Which assessment/) as HTMLSelectElement).value).toBe('week6');
    await user.clear(within(form).getByLabelText(/^Date/));
    await user.type(within(form).getByLabelText(/^Date/), '2026-02-16');
    await user.type(within(form).getByLabelText('Pain on first steps in the morning (0–10)'), '4');
    await user.type(within(form).getByLabelText('Foot and ankle function, daily living (0–100)'), '60');
    await user.click(within(form).getByRole('button', { name: 'Save follow-up' }));

    expect(await screen.findByText(/Week 6 saved/)).toBeTruthy();
    const post = calls.find((c) => c.method === 'POST')!;
    expect(post.url).toBe('/api/episodes/12/assessments');
    expect(post.body).toEqual({ timepoint: 'week6', assessedOn: '2026-02-16', reporter: 'clinician', scores: { 'nprs-first-step': 4, 'faam-adl': 60 } });

    const table = screen.getByRole('table', { name: 'Assessments and scores of this episode' });
    const row = within(table).getByRole('row', { name: /Week 6/ });
    // Pain 7 → 4 is 3 points better (MCID 2); function 55 → 60 is 5 better, short of its MCID of 8.
    expect(within(row).getByText('+3 since start')).toBeTruthy();
    expect(within(row).getByText('reached MCID (2)')).toBeTruthy();
    expect(within(row).getByText('+5 since start')).toBeTruthy();
    expect(within(row).getByText('below MCID (8)')).toBeTruthy();
    expect(screen.getByRole('img', { name: /Pain on first steps.*week 0: 7, week 6: 4/ })).toBeTruthy();
    // The form starts afresh for the next assessment.
    const next = screen.getByRole('form', { name: 'Add a follow-up' });
    expect((within(next).getByLabelText('Pain on first steps in the morning (0–10)') as HTMLInputElement).value).toBe('');
    expect((within(next).getByLabelText(/Which assessment/) as HTMLSelectElement).value).toBe('week12');
  });

  it('rejects a follow-up score outside the instrument’s range before sending it', async () => {
    const { calls } = server(() => ({ status: 200, body: episodeDetail() }));
    renderApp('/episodes/12');
    const user = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Add a follow-up' });
    await user.type(within(form).getByLabelText('Global rating of change (−7 to +7)'), '9');
    await user.click(within(form).getByRole('button', { name: 'Save follow-up' }));
    expect(await within(form).findByText('Global rating of change (−7 to +7) runs from -7 to 7; enter a score in that range')).toBeTruthy();
    expect(calls.some((c) => c.method === 'POST')).toBe(false);
  });

  it('says plainly when someone else changed the episode (409) and offers a reload', async () => {
    const { calls } = server((c) =>
      c.method === 'PATCH' ? { status: 409, body: { error: { message: 'Version 3 is out of date' } } } : { status: 200, body: episodeDetail() },
    );
    renderApp('/episodes/12');
    const user = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'End the episode' });
    await user.selectOptions(within(form).getByLabelText(/Reason/), 'goals-met');
    await user.click(within(form).getByRole('button', { name: 'End the episode' }));

    const alert = await within(form).findByRole('alert');
    expect(alert.textContent).toMatch(/Someone else changed this episode after you opened it/);
    const patch = calls.find((c) => c.method === 'PATCH')!;
    expect(patch.body).toMatchObject({ status: 'discharged', dischargeReason: 'goals-met', version: 3 });
    const before = calls.filter((c) => c.url === '/api/episodes/12' && c.method === 'GET').length;
    await user.click(within(alert).getByRole('button', { name: 'Reload' }));
    await waitFor(() => expect(calls.filter((c) => c.url === '/api/episodes/12' && c.method === 'GET').length).toBe(before + 1));
  });

  it('saves the full list of interventions with start week and level', async () => {
    const { calls } = server((c) => (c.method === 'PUT' ? { status: 200, body: episodeDetail() } : { status: 200, body: episodeDetail() }));
    renderApp('/episodes/12');
    const user = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'Interventions' });
    await user.click(within(form).getByLabelText('Graded heel raises'));
    await user.clear(within(form).getByLabelText('Graded heel raises: from week'));
    await user.type(within(form).getByLabelText('Graded heel raises: from week'), '2');
    await user.selectOptions(within(form).getByLabelText('Graded heel raises: highest level reached'), '2');
    await user.click(within(form).getByRole('button', { name: 'Save interventions' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'PUT')).toBe(true));
    expect(calls.find((c) => c.method === 'PUT')!.body).toEqual({
      interventions: [
        { code: 'education-load', startWeek: 0, maxLevel: null },
        { code: 'heel-raises', startWeek: 2, maxLevel: 2 },
      ],
    });
  });
});
