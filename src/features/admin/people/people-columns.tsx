import type { Person } from '../../../../shared/schemas/admin';
import { dataColumnHelper } from '../../../components/data-table';
import { ROLE_LABELS } from '../../auth';
import { formatDay } from '../format';
import { PersonActions } from './person-actions';
import { STATUS_WORDS } from './people-params';

const col = dataColumnHelper<Person>();

/** Columns of the people table; the server pages it and orders by clinic, role and e-mail. */
export function peopleColumns(opts: { canChange: boolean; selfId: number | null; onChange: (p: Person) => void }) {
  return col.columns([
    col.accessor('name', {
      header: 'Person',
      enableSorting: false,
      cell: (info) => (
        <>
          <span className="font-medium">{info.getValue() || '(name not set yet)'}</span>
          <span className="block text-ink-soft">{info.row.original.email}</span>
        </>
      ),
    }),
    col.accessor('role', { header: 'Role', enableSorting: false, cell: (info) => ROLE_LABELS[info.getValue()] }),
    col.accessor('clinicCode', { header: 'Clinic', enableSorting: false, cell: (info) => info.getValue() ?? '—' }),
    col.accessor('status', {
      header: 'Status',
      enableSorting: false,
      cell: (info) => (
        <span
          className={
            info.getValue() === 'deactivated'
              ? 'text-ink-faint'
              : info.getValue() === 'invited'
                ? 'text-caution'
                : 'text-good'
          }
        >
          {STATUS_WORDS[info.getValue()]}
        </span>
      ),
    }),
    col.accessor('createdAt', { header: 'Since', enableSorting: false, cell: (info) => formatDay(info.getValue()) }),
    col.display({
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      cell: (info) => (
        <PersonActions
          person={info.row.original}
          canChange={opts.canChange}
          isSelf={info.row.original.id === opts.selfId}
          onChange={() => opts.onChange(info.row.original)}
        />
      ),
    }),
  ]);
}
