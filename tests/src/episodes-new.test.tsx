import { createHmac, pbkdf2Sync } from 'node:crypto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { forgetPseudonymKey } from '../../src/features/episodes/pseudonym-key';
import { fakeServer, renderApp, type Call } from './auth-helpers';
import { episodeDetail, instruments, salt, SALT } from './episodes-fixtures';

afterEach(() => {
  cleanup();
  forgetPseudonymKey();
  vi.unstubAllGlobals();
});

function server(created?: (c: Call) => void) {
  return fakeServer({
    role: 'clinician',
    extra: (c) => {
      if (c.url === '/api/instruments') return { status: 200, body: { items: instruments, total: instruments.length } };
      if (c.url === '/api/clinics/current/pseudonym-salt') return { status: 200, body: salt };
      if (c.url === '/api/episodes' && c.method === 'POST') {
        created?.(c);
        return { status: 201, body: episodeDetail({ id: 77, reference: 'HB-0077' }) };
      }
      if (c.url === '/api/episodes/77') return { status: 200, body: episodeDetail({ id: 77, reference: 'HB-0077' }) };
      if (c.url === '/api/interventions') return { status: 200, body: { items: [], total: 0 } };
      return undefined;
    },
  });
}

/** The pseudonym as any other implementation of the rule makes it: Node's own PBKDF2 and HMAC. */
function nodePseudonym(passphrase: string, normalisedId: string): string {
  const key = pbkdf2Sync(passphrase, Buffer.from(SALT, 'hex'), 310_000, 32, 'sha256');
  return createHmac('sha256', key).update(normalisedId, 'utf8').digest('hex');
}

describe('new episode form', () => {
  it('shows each error next to its field, naming the instrument’s range, and sends nothing', async () => {
    const { calls } = server();
    renderApp('/episodes/new');
    const user = userEvent.setup();
    const form = await screen.findByRole('form', { name: 'New episode' });
    await user.type(within(form).getByLabelText(/Age in years/), '12');
    await user.type(within(form).getByLabelText('Pain on first steps in the morning (0–10)'), '14');
    await user.type(within(form).getByLabelText('Foot and ankle function, daily living (0–100)'), '60');
    await user.click(within(form).getByRole('button', { name: 'Save episode' }));

    const pain = within(form).getByLabelText('Pain on first steps in the morning (0–10)');
    await waitFor(() => expect(pain.getAttribute('aria-invalid')).toBe('true'));
    const painError = document.getElementById(pain.getAttribute('aria-describedby')!.split(' ').at(-1)!)!;
    expect(painError.textContent).toBe('Pain on first steps in the morning (0–10) runs from 0 to 10; enter a score in that range');
    // A score inside its range is not flagged.
    expect(within(form).getByLabelText('Foot and ankle function, daily living (0–100)').getAttribute('aria-invalid')).toBe('false');

    const age = within(form).getByLabelText(/Age in years/);
    expect(age.getAttribute('aria-invalid')).toBe('true');
    expect(within(form).getByText('The registry takes adults (16 and over)')).toBeTruthy();
    expect(within(form).getByText('Enter the clinic’s episode reference')).toBeTruthy();
    expect(within(form).getByLabelText(/Height \(cm\)/).getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByText(/Make the pseudonym before saving/)).toBeTruthy();
    expect(calls.some((c) => c.url === '/api/episodes' && c.method === 'POST')).toBe(false);
  });

  it('makes the pseudonym in the browser exactly as node:crypto does, and sends only the pseudonym', async () => {
    expect(globalThis.crypto?.subtle).toBeDefined(); // Web Crypto in the test environment (Node 20)
    const passphrase = 'Harbour lights at 6, never before';
    const localId = '  mrn-00451 ';
    const expected = nodePseudonym(passphrase, 'MRN-00451'); // the rule trims and upper-cases the identifier
    let sent: Call | undefined;
    const { calls } = server((c) => (sent = c));
    renderApp('/episodes/new');
    const user = userEvent.setup();

    expect(await screen.findByText(/never leave this browser/)).toBeTruthy();
    await user.type(screen.getByLabelText('Clinic passphrase'), passphrase);
    await user.click(screen.getByRole('button', { name: 'Use passphrase' }));
    await user.type(await screen.findByLabelText('Local patient identifier', {}, { timeout: 5000 }), localId);
    await user.click(screen.getByRole('button', { name: 'Make pseudonym' }));
    expect(await screen.findByText(expected.slice(0, 8))).toBeTruthy();

    const form = screen.getByRole('form', { name: 'New episode' });
    await user.type(within(form).getByLabelText(/Episode reference/), 'HB-0077');
    await user.selectOptions(within(form).getByLabelText(/Affected heel/), 'right');
    await user.type(within(form).getByLabelText(/Weeks of symptoms/), '14');
    await user.type(within(form).getByLabelText(/Age in years/), '47');
    await user.selectOptions(within(form).getByLabelText(/^Sex/), 'female');
    await user.type(within(form).getByLabelText(/Height \(cm\)/), '168');
    await user.type(within(form).getByLabelText(/Weight \(kg\)/), '74.5');
    await user.selectOptions(within(form).getByLabelText(/Activity group/), 'active');
    await user.type(within(form).getByLabelText('Pain on first steps in the morning (0–10)'), '7');
    await user.click(within(form).getByRole('button', { name: 'Save episode' }));

    await waitFor(() => expect(sent).toBeDefined());
    expect(sent!.body).toMatchObject({ pseudonym: expected, reference: 'HB-0077', ageYears: 47, weightKg: 74.5, baseline: { scores: { 'nprs-first-step': 7 } } });
    expect((sent!.body as { baseline: { scores: object } }).baseline.scores).toEqual({ 'nprs-first-step': 7 });
    // Neither the passphrase nor the identifier left the browser in any request.
    const wire = JSON.stringify(calls.map((c) => [c.url, c.body]));
    expect(wire).not.toContain('Harbour');
    expect(wire.toUpperCase()).not.toContain('MRN-00451');
    expect(await screen.findByRole('heading', { name: 'Episode HB-0077' })).toBeTruthy();
  }, 30_000); // PBKDF2 with 310,000 iterations is slow on purpose
});
