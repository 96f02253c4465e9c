import type { AuditEvent } from '../../../../shared/schemas/admin';
import { dataColumnHelper } from '../../../components/data-table';
import { formatWhen } from '../format';

const col = dataColumnHelper<AuditEvent>();

/** The detail of an event, shortened; the whole of it opens on request. */
function Detail({ detail }: { detail: Record<string, unknown> }) {
  const text = JSON.stringify(detail);
  if (text === '{}') return <span className="text-ink-faint">—</span>;
  if (text.length <= 80) return <code className="break-all text-xs">{text}</code>;
  return (
    <details>
      <summary className="cursor-pointer text-xs text-accent">{text.slice(0, 60)}…</summary>
      <pre className="relative mt-1 max-w-md overflow-x-auto whitespace-pre-wrap break-all text-xs">
        {JSON.stringify(detail, null, 2)}
      </pre>
    </details>
  );
}

export const auditColumns = col.columns([
  col.accessor('at', {
    header: 'When',
    enableSorting: false,
    cell: (info) => <span className="whitespace-nowrap">{formatWhen(info.getValue())}</span>,
  }),
  col.accessor('actorName', {
    header: 'Who',
    enableSorting: false,
    cell: (info) => {
      const e = info.row.original;
      if (e.actorId === null) return <span className="text-ink-faint">the system</span>;
      return (
        <>
          <span>{e.actorName || e.actorEmail}</span>
          {e.actorName ? <span className="block text-xs text-ink-faint">{e.actorEmail}</span> : null}
        </>
      );
    },
  }),
  col.accessor('action', { header: 'Action', enableSorting: false }),
  col.accessor('entity', {
    header: 'What',
    enableSorting: false,
    cell: (info) => `${info.getValue()}${info.row.original.entityId ? ` #${info.row.original.entityId}` : ''}`,
  }),
  col.accessor('clinicCode', { header: 'Clinic', enableSorting: false, cell: (info) => info.getValue() ?? '—' }),
  col.accessor('detail', {
    header: 'Detail',
    enableSorting: false,
    cell: (info) => <Detail detail={info.getValue()} />,
  }),
]);
