import { Link, useNavigate } from 'react-router-dom';
import type { CohortSummary } from '../../shared/schemas/cohort';
import { EmptyState } from '../components/empty-state';
import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { cohortPath, paths } from '../config/paths';
import { useDuplicateCohort } from '../features/cohorts/api/duplicate-cohort';
import { useCohorts } from '../features/cohorts/api/list-cohorts';
import { primaryButton, quietButton } from '../features/cohorts/buttons';
import { countShort, savedWhen, signed } from '../features/cohorts/format';

/** Saved cohorts: each re-run on today's data, with how its count changed since it was saved. */
export function Component() {
  const cohorts = useCohorts();
  const duplicate = useDuplicateCohort();
  const navigate = useNavigate();
  const copy = (c: CohortSummary) => duplicate.mutate(c.id, { onSuccess: (d) => void navigate(cohortPath(d.id)) });
  return (
    <section className="space-y-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div className="space-y-1">
          <h1 className="text-2xl font-semibold">Cohorts</h1>
          <p className="max-w-prose text-sm text-ink-soft">
            Saved cohort definitions, counted again on today’s registry. Only episodes with research consent are ever
            counted.
          </p>
        </div>
        <Link to={paths.newCohort} className={primaryButton}>
          New cohort
        </Link>
      </header>
      {duplicate.error ? <ErrorNotice error={duplicate.error} title="The cohort was not duplicated" /> : null}
      {cohorts.error ? (
        <ErrorNotice
          error={cohorts.error}
          title="The cohorts could not be loaded"
          onRetry={() => void cohorts.refetch()}
        />
      ) : !cohorts.data ? (
        <Loading label="Counting the saved cohorts…" />
      ) : cohorts.data.items.length === 0 ? (
        <EmptyState
          title="No saved cohort yet"
          action={
            <Link to={paths.newCohort} className={primaryButton}>
              Build one
            </Link>
          }
        >
          Define a cohort by its criteria, watch the count and outcomes as you go, and save it to request its data.
        </EmptyState>
      ) : (
        <div className="relative overflow-x-auto rounded border border-line bg-surface">
          <table className="tabular w-full text-left text-sm">
            <caption className="sr-only">Saved cohorts</caption>
            <thead className="border-b border-line bg-canvas text-xs text-ink-soft">
              <tr>
                <th scope="col" className="px-3 py-2 font-medium">
                  Cohort
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  Version
                </th>
                <th scope="col" className="px-3 py-2 text-right font-medium">
                  When saved
                </th>
                <th scope="col" className="px-3 py-2 text-right font-medium">
                  Today
                </th>
                <th scope="col" className="px-3 py-2 text-right font-medium">
                  Change
                </th>
                <th scope="col" className="px-3 py-2">
                  <span className="sr-only">Actions</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {cohorts.data.items.map((c) => (
                <tr key={c.id} className="border-b border-line last:border-0">
                  <th scope="row" className="px-3 py-2 font-normal">
                    <Link to={cohortPath(c.id)} className="font-medium text-accent hover:underline">
                      {c.name}
                    </Link>
                    <p className="text-xs text-ink-faint">
                      {c.mine ? 'yours' : `by ${c.ownerName}`}
                      {c.duplicatedFromId ? ' · a copy' : ''}
                    </p>
                  </th>
                  <td className="px-3 py-2">
                    v{c.currentVersion} <span className="text-xs text-ink-faint">{savedWhen(c.savedAt)}</span>
                  </td>
                  <td className="px-3 py-2 text-right">{countShort(c.countAtSave)}</td>
                  <td className="px-3 py-2 text-right font-medium">{countShort(c.countNow)}</td>
                  <td className="px-3 py-2 text-right">
                    {c.change === null ? (
                      <span className="text-ink-faint">hidden</span>
                    ) : c.change === 0 ? (
                      'no change'
                    ) : (
                      signed(c.change)
                    )}
                  </td>
                  <td className="px-3 py-2 text-right">
                    <button
                      type="button"
                      className={quietButton}
                      onClick={() => copy(c)}
                      disabled={duplicate.isPending}
                    >
                      Duplicate
                    </button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
