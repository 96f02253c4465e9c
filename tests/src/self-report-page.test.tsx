import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { fakeServer, renderApp } from './auth-helpers';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const TOKEN = 'abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQ';
const form = {
  clinicName: 'Seaview Heel Clinic',
  timepoint: 'week6',
  questions: [
    { code: 'nprs-first-step', label: 'x', min: 0, max: 10, step: 1, input: 'rating' },
    { code: 'lefs', label: 'x', min: 0, max: 80, step: 1, input: 'number' },
    { code: 'groc', label: 'x', min: -7, max: 7, step: 1, input: 'rating' },
  ],
};

describe('patient self-report page', () => {
  it('shows the clinic, the caution and the questions outside the app shell', async () => {
    fakeServer({ extra: (c) => (c.url === `/api/self-report/${TOKEN}` ? { status: 200, body: form } : undefined) });
    renderApp(`/report/${TOKEN}`);
    expect((await screen.findByRole('heading', { level: 1 })).textContent).toContain('Seaview Heel Clinic');
    expect(screen.queryByRole('navigation')).toBeNull();
    expect(screen.getByText(/do not replace your clinician/)).toBeTruthy();
    expect(screen.getByText(/numbness, tingling/)).toBeTruthy();
    const pain = screen.getByRole('group', { name: /first steps this morning/ });
    expect(within(pain).getAllByRole('radio')).toHaveLength(11);
    const change = screen.getByRole('group', { name: /Compared with when your care started/ });
    expect(
      within(change)
        .getAllByRole('radio')
        .map((r) => (r as HTMLInputElement).value),
    ).toEqual(['-7', '-6', '-5', '-4', '-3', '-2', '-1', '0', '1', '2', '3', '4', '5', '6', '7']);
    expect(within(change).getByRole('radio', { name: '+7' })).toBeTruthy();
  });

  it('asks for at least one answer and checks ranges before sending; then sends totals only', async () => {
    const { calls } = fakeServer({
      extra: (c) =>
        c.url === `/api/self-report/${TOKEN}`
          ? c.method === 'POST'
            ? { status: 201, body: { received: true } }
            : { status: 200, body: form }
          : undefined,
    });
    renderApp(`/report/${TOKEN}`);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Send my answers' }));
    expect(await screen.findByText(/answer at least one of the questions/)).toBeTruthy();
    await user.type(screen.getByLabelText(/leg function questionnaire/), '81');
    await user.click(screen.getByRole('button', { name: 'Send my answers' }));
    expect(await screen.findByText(/Enter a number from 0 to 80/)).toBeTruthy();
    expect(calls.some((c) => c.method === 'POST')).toBe(false);
    await user.clear(screen.getByLabelText(/leg function questionnaire/));
    await user.type(screen.getByLabelText(/leg function questionnaire/), '52');
    await user.click(within(screen.getByRole('group', { name: /first steps/ })).getByRole('radio', { name: '4' }));
    await user.click(within(screen.getByRole('group', { name: /Compared with/ })).getByRole('radio', { name: '−2' }));
    await user.click(screen.getByRole('button', { name: 'Send my answers' }));
    expect(await screen.findByRole('heading', { name: /Thank you/ })).toBeTruthy();
    const post = calls.find((c) => c.method === 'POST')!;
    expect(post.body).toEqual({ scores: { 'nprs-first-step': 4, lefs: 52, groc: -2 }, avgDailySteps: null });
  });

  it('explains a used or unknown link in plain words', async () => {
    fakeServer({
      extra: (c) =>
        c.url.startsWith('/api/self-report/')
          ? { status: 410, body: { error: { message: 'This link has already been used.' } } }
          : undefined,
    });
    renderApp(`/report/${TOKEN}`);
    expect(await screen.findByRole('heading', { name: 'This link cannot take answers any more' })).toBeTruthy();
    expect(screen.getByText('This link has already been used.')).toBeTruthy();
    cleanup();
    fakeServer({
      extra: (c) =>
        c.url.startsWith('/api/self-report/')
          ? { status: 404, body: { error: { message: 'This link does not work.' } } }
          : undefined,
    });
    renderApp('/report/tampered');
    await waitFor(() => expect(screen.getByRole('heading', { name: 'This link does not work' })).toBeTruthy());
  });
});
