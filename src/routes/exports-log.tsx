import { EmptyState } from '../components/empty-state';
import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { savedWhen } from '../features/cohorts/format';
import { useExportsLog } from '../features/data-requests/api/list-exports';
import { EXPORT_STATUS_LABELS } from '../features/data-requests/labels';
import { TableFrame } from '../components/table-frame';

/** The steward's log of every research export: who, which request, how many rows, the file's SHA-256. */
export function Component() {
  const log = useExportsLog();
  return (
    <section className="space-y-6">
      <header className="space-y-1">
        <h1 className="text-2xl font-semibold">Exports log</h1>
        <p className="max-w-prose text-sm text-ink-soft">
          Every download of a de-identified export, including abandoned ones. The SHA-256 identifies the exact file a
          researcher received.
        </p>
      </header>
      {log.error ? (
        <ErrorNotice error={log.error} title="The exports log could not be loaded" onRetry={() => void log.refetch()} />
      ) : !log.data ? (
        <Loading label="Loading the exports log…" />
      ) : log.data.items.length === 0 ? (
        <EmptyState title="No export yet">Exports appear here as researchers download approved requests.</EmptyState>
      ) : (
        <TableFrame
          caption="Research exports, newest first"
          cell="px-3 py-2"
          columns={[
            'When',
            'Researcher',
            'Request',
            'Outcome',
            { label: 'Rows', numeric: true },
            { label: 'Generalised / left out (k)', numeric: true },
            'SHA-256',
          ]}
        >
          {log.data.items.map((e) => (
            <tr key={e.id} className="border-b border-line last:border-0">
              <td className="px-3 py-2 whitespace-nowrap">{savedWhen(e.finishedAt)}</td>
              <td className="px-3 py-2">{e.user.name || e.user.email}</td>
              <td className="px-3 py-2">
                #{e.requestId} · {e.cohortName}
              </td>
              <td className={`px-3 py-2 ${e.status === 'completed' ? '' : 'text-caution'}`}>
                {EXPORT_STATUS_LABELS[e.status]}
              </td>
              <td className="px-3 py-2 text-right">{e.rowCount}</td>
              <td className="px-3 py-2 text-right">
                {e.generalisedRows} / {e.suppressedRows} ({e.k})
              </td>
              <td className="px-3 py-2 font-mono text-xs" title={e.sha256}>
                {e.sha256.slice(0, 16)}…
              </td>
            </tr>
          ))}
        </TableFrame>
      )}
    </section>
  );
}
