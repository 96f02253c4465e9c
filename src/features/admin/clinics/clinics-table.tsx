import { Fragment, useState } from 'react';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';
import type { ClinicSummary } from '../../../../shared/schemas/admin';
import { linkButton } from '../components/buttons';
import { formatShare, formatWhen } from '../format';
import { ClinicEditor } from './clinic-editor';
import { TableFrame } from '../../../components/table-frame';

const td = 'px-4 py-2.5 align-top';

/** Every clinic with its running figures; a row opens its editor in place. */
export function ClinicsTable({ clinics }: { clinics: ClinicSummary[] }) {
  const [editing, setEditing] = useState<number | null>(null);
  return (
    <TableFrame
      caption="Clinics of the registry"
      cell="px-4 py-2"
      columns={[
        'Clinic',
        'Region',
        'State',
        'People',
        'Episodes (open)',
        'Week-12 follow-up',
        'Last submission',
        '<span className="sr-only">Actions</span>',
      ]}
    >
      {clinics.map((c) => (
        <Fragment key={c.id}>
          <tr className="border-b border-line last:border-0">
            <td className={td}>
              <span className="font-medium">{c.code}</span>
              <span className="block text-ink-soft">{c.displayName}</span>
            </td>
            <td className={td}>{c.region}</td>
            <td className={td}>
              {c.active ? (
                <span className="text-good">Accepting data</span>
              ) : (
                <span className="text-caution">Deactivated</span>
              )}
            </td>
            <td className={td}>
              <Link
                to={`${paths.consolePeople}?clinic=${c.id}`}
                className="text-accent hover:underline"
                aria-label={`${c.activeUsers} active people at ${c.code}`}
              >
                {c.activeUsers}
              </Link>
            </td>
            <td className={td}>
              {c.episodes} ({c.openEpisodes})
            </td>
            <td className={td} title="Episodes past their week-12 window that have a week-12 assessment">
              {formatShare(c.completeness)}
              <span className="block text-xs text-ink-faint">
                {c.withWeek12} of {c.pastWeek12Window} due
              </span>
            </td>
            <td className={td}>{formatWhen(c.lastSubmissionAt)}</td>
            <td className={td}>
              <button
                type="button"
                className={linkButton}
                onClick={() => setEditing(editing === c.id ? null : c.id)}
                aria-expanded={editing === c.id}
              >
                Edit {c.code}
              </button>
            </td>
          </tr>
          {editing === c.id ? (
            <tr className="border-b border-line">
              <td colSpan={8} className="px-4 py-3">
                <ClinicEditor clinic={c} onDone={() => setEditing(null)} />
              </td>
            </tr>
          ) : null}
        </Fragment>
      ))}
    </TableFrame>
  );
}
