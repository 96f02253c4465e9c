import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { DashboardBody } from '../../src/features/analytics/components/dashboard-parts';

// The sequence every dashboard follows below its filters: loading, failure with a way out, or the numbers.
afterEach(cleanup);

const query = (over: Partial<Parameters<typeof DashboardBody<string>>[0]['query']>) => ({
  data: undefined as string | undefined,
  error: null as unknown,
  isPending: false,
  isError: false,
  isPlaceholderData: false,
  refetch: vi.fn(),
  ...over,
});

function show(q: ReturnType<typeof query>, onReset = vi.fn()) {
  render(
    <DashboardBody query={q} loading="Counting…" onReset={onReset}>
      {(d) => <p>numbers: {d}</p>}
    </DashboardBody>,
  );
  return onReset;
}

describe('DashboardBody', () => {
  it('shows the loading outline with its label while the first answer is pending', () => {
    show(query({ isPending: true }));
    expect(screen.getAllByText('Counting…').length).toBeGreaterThan(0);
    expect(screen.queryByText(/numbers:/)).toBeNull();
  });

  it('offers to clear the filters when the server refuses them (422), and to retry', () => {
    const q = query({ isError: true, error: Object.assign(new Error('Invalid filters'), { status: 422 }) });
    const onReset = show(q);
    fireEvent.click(screen.getByRole('button', { name: 'Clear the filters' }));
    expect(onReset).toHaveBeenCalledTimes(1);
    fireEvent.click(screen.getByRole('button', { name: 'Reload' }));
    expect(q.refetch).toHaveBeenCalledTimes(1);
  });

  it('does not offer to clear the filters for other failures', () => {
    show(query({ isError: true, error: Object.assign(new Error('Down'), { status: 503 }) }));
    expect(screen.queryByRole('button', { name: 'Clear the filters' })).toBeNull();
  });

  it('keeps numbers already shown when a refresh fails, with the failure above them', () => {
    show(query({ data: '42', isError: true, error: Object.assign(new Error('Down'), { status: 503 }) }));
    expect(screen.getByText('numbers: 42')).toBeTruthy();
    expect(screen.getByText('These numbers could not be loaded')).toBeTruthy();
  });
});
