import { Link } from 'react-router-dom';
import type { FollowUpItem } from '../../../shared/schemas/follow-ups';
import { dataColumnHelper } from '../../components/data-table';
import { episodeFollowUpPath, episodePath } from '../../config/paths';
import { formatDate } from '../episodes/format';
import { FOLLOW_UP_LABELS, STATE_LABELS, STATE_TONE, daysLeftText } from './labels';

const col = dataColumnHelper<FollowUpItem>();

/** Columns of the due list; ids of sortable columns are the server's sort keys. */
export function followUpColumns(onSelfReport: (item: FollowUpItem) => void) {
  return col.columns([
    col.accessor('reference', {
      header: 'Episode',
      cell: (info) => (
        <Link to={episodePath(info.row.original.episodeId)} className="font-medium text-accent hover:underline">
          {info.getValue()}
        </Link>
      ),
    }),
    col.accessor('timepoint', { header: 'Follow-up', cell: (info) => FOLLOW_UP_LABELS[info.getValue()] }),
    col.accessor('state', {
      header: 'State',
      enableSorting: false,
      cell: (info) => (
        <span className={`inline-block rounded-full px-2 py-0.5 text-xs ${STATE_TONE[info.getValue()]}`}>
          {STATE_LABELS[info.getValue()]}
        </span>
      ),
    }),
    col.accessor('opensOn', { header: 'Window opens', cell: (info) => formatDate(info.getValue()) }),
    col.accessor('closesOn', {
      header: 'Window closes',
      cell: (info) => (
        <span>
          {formatDate(info.getValue())}
          <span className="block text-xs text-ink-faint">{daysLeftText(info.row.original.daysLeft)}</span>
        </span>
      ),
    }),
    col.accessor('startDate', { header: 'Care started', cell: (info) => formatDate(info.getValue()) }),
    col.display({
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      cell: (info) => {
        const f = info.row.original;
        return (
          <div className="flex flex-wrap items-center gap-2">
            <Link
              to={episodeFollowUpPath(f.episodeId, f.timepoint)}
              aria-label={`Record scores for ${f.reference}, ${FOLLOW_UP_LABELS[f.timepoint]}`}
              className="rounded bg-accent px-3 py-1.5 text-xs font-medium text-white hover:bg-accent-strong"
            >
              Record scores
            </Link>
            <button
              type="button"
              onClick={() => onSelfReport(f)}
              aria-label={`Patient link for ${f.reference}, ${FOLLOW_UP_LABELS[f.timepoint]}`}
              className="rounded border border-line bg-surface px-3 py-1.5 text-xs text-ink hover:border-accent"
            >
              Patient link
            </button>
            {f.linkExpiresAt ? (
              <span className="text-xs text-ink-faint">
                Link waiting until {formatDate(f.linkExpiresAt.slice(0, 10))}
              </span>
            ) : null}
          </div>
        );
      },
    }),
  ]);
}
