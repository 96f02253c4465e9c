import { useHealth } from '../features/health/api/get-health';

/** A small dot that says whether the registry's server and database answer. */
export function ConnectionStatus() {
  const { data, isError } = useHealth();
  const up = data?.db === 'up' && !isError;
  return (
    <span className="flex items-center gap-1.5 text-xs text-ink-faint" role="status">
      <span aria-hidden className={`h-2 w-2 rounded-full ${up ? 'bg-good' : isError ? 'bg-bad' : 'bg-line'}`} />
      {up ? 'Registry online' : isError ? 'Registry unreachable' : 'Connecting…'}
    </span>
  );
}
