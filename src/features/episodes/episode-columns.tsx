import { Link } from 'react-router-dom';
import type { EpisodeListItem } from '../../../shared/schemas/episode';
import { dataColumnHelper } from '../../components/data-table';
import { episodePath } from '../../config/paths';
import { formatChange, formatDate, formatNumber } from './format';
import { ACTIVITY_LABELS, STATUS_LABELS } from './labels';
import { StatusBadge } from './status-badge';

const col = dataColumnHelper<EpisodeListItem>();

/** Columns of the caseload; ids of sortable columns are the server's sort keys. */
export const episodeColumns = col.columns([
  col.accessor('reference', {
    header: 'Episode',
    cell: (info) => (
      <Link
        to={episodePath(info.row.original.id)}
        className="whitespace-nowrap font-medium text-accent hover:underline"
      >
        {info.getValue()}
      </Link>
    ),
  }),
  col.accessor('startDate', {
    header: 'Started',
    cell: (info) => <span className="whitespace-nowrap">{formatDate(info.getValue())}</span>,
  }),
  col.accessor('status', {
    header: 'Status',
    cell: (info) => <StatusBadge status={info.getValue()} label={STATUS_LABELS[info.getValue()]} />,
  }),
  col.accessor('weeksInCare', { header: 'Weeks in care' }),
  col.accessor('activityProfile', {
    header: 'Activity',
    enableSorting: false,
    cell: (info) => ACTIVITY_LABELS[info.getValue()],
  }),
  col.accessor('latestFirstStepPain', {
    header: 'First-step pain now (0–10)',
    enableSorting: false,
    cell: (info) => formatNumber(info.getValue()),
  }),
  // The server sends latest minus baseline; we flip it so + always reads as "less pain" (as on the detail screen).
  col.accessor((row) => (row.firstStepPainChange === null ? null : -row.firstStepPainChange), {
    id: 'painImprovement',
    header: 'Pain change so far (+ = less pain)',
    enableSorting: false,
    cell: (info) => formatChange(info.getValue()),
  }),
  col.accessor('lastAssessedOn', {
    header: 'Last scores',
    enableSorting: false,
    cell: (info) => <span className="whitespace-nowrap">{formatDate(info.getValue())}</span>,
  }),
]);
