import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { CohortCriteriaSchema, type CohortCriteria, type CohortDetail } from '../../shared/schemas/cohort';
import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { cohortPath, paths } from '../config/paths';
import { useCohort } from '../features/cohorts/api/get-cohort';
import { useCohortPreview } from '../features/cohorts/api/preview-cohort';
import { AttritionTable } from '../features/cohorts/attrition-table';
import { CriteriaForm } from '../features/cohorts/criteria-form';
import { countText } from '../features/cohorts/format';
import { OutcomeSummaryView } from '../features/cohorts/outcome-summary';
import { SaveCohortForm } from '../features/cohorts/save-cohort-form';
import { useDebouncedValue } from '../features/cohorts/use-debounced-value';
import { VersionsList } from '../features/cohorts/versions-list';

const NO_CRITERIA: CohortCriteria = CohortCriteriaSchema.parse({});

/** Cohort builder: criteria on the left, the live preview (count, flow of exclusions, outcomes) on the right. */
export function Component() {
  const { cohortId } = useParams();
  const id = cohortId === undefined ? null : Number(cohortId);
  const cohort = useCohort(id);
  if (id !== null && !Number.isInteger(id)) return <ErrorNotice error={new Error('That is not a cohort address')} />;
  if (id !== null && cohort.error)
    return (
      <ErrorNotice error={cohort.error} title="The cohort could not be loaded" onRetry={() => void cohort.refetch()} />
    );
  if (id !== null && !cohort.data) return <Loading label="Loading the cohort…" />;
  // A fresh builder per cohort, so its criteria start from what is saved.
  return <Builder key={cohort.data?.id ?? 'new'} cohort={cohort.data ?? null} />;
}

function Builder({ cohort }: { cohort: CohortDetail | null }) {
  const [criteria, setCriteria] = useState<CohortCriteria>(cohort?.criteria ?? NO_CRITERIA);
  const settled = useDebouncedValue(criteria, 400);
  const preview = useCohortPreview(settled);
  const navigate = useNavigate();
  const p = preview.data;
  return (
    <section className="space-y-6">
      <header className="space-y-1">
        <p className="text-sm">
          <Link to={paths.cohorts} className="text-accent hover:underline">
            Saved cohorts
          </Link>
        </p>
        <h1 className="text-2xl font-semibold">{cohort ? cohort.name : 'New cohort'}</h1>
        {cohort ? (
          <p className="text-sm text-ink-soft">
            Version {cohort.currentVersion}
            {cohort.description ? ` · ${cohort.description}` : ''}
          </p>
        ) : null}
      </header>
      <div className="grid gap-8 lg:grid-cols-[2fr_3fr]">
        <div className="space-y-6">
          <CriteriaForm value={criteria} onChange={setCriteria} />
          <div className="space-y-3 border-t border-line pt-4">
            <h2 className="text-base font-semibold">Save</h2>
            <SaveCohortForm
              cohort={cohort}
              criteria={criteria}
              readOnly={cohort !== null && !cohort.mine}
              onSaved={(saved) => {
                if (!cohort) void navigate(cohortPath(saved.id));
              }}
            />
          </div>
          {cohort ? (
            <div className="space-y-2 border-t border-line pt-4">
              <h2 className="text-base font-semibold">Versions</h2>
              <VersionsList cohort={cohort} onShow={setCriteria} />
            </div>
          ) : null}
        </div>
        <div className="space-y-5" aria-live="polite" aria-busy={preview.isFetching}>
          {preview.error ? <ErrorNotice error={preview.error} title="These criteria cannot be previewed" /> : null}
          {!p ? (
            <Loading label="Counting the cohort…" />
          ) : (
            <>
              <div className={`flex flex-wrap items-end gap-8 ${preview.isFetching ? 'opacity-60' : ''}`}>
                <div>
                  <p className="text-xs uppercase tracking-wide text-ink-faint">Episodes</p>
                  <p className="tabular text-3xl font-semibold">{countText(p.count)}</p>
                </div>
                <div>
                  <p className="text-xs uppercase tracking-wide text-ink-faint">Clinics</p>
                  <p className="tabular text-3xl font-semibold">{p.clinics}</p>
                </div>
                {preview.isFetching ? <p className="text-sm text-ink-faint">Updating…</p> : null}
              </div>
              {p.suppressedBelow ? (
                <p className="text-xs text-ink-faint">
                  Counts under {p.suppressedBelow} are shown as “&lt;{p.suppressedBelow}” to protect small groups.
                </p>
              ) : null}
              <div className="space-y-2">
                <h2 className="text-base font-semibold">How the cohort is reached</h2>
                <AttritionTable steps={p.attrition} />
              </div>
              <div className="space-y-2">
                <h2 className="text-base font-semibold">Outcomes of this cohort</h2>
                <OutcomeSummaryView summary={p.summary} />
              </div>
            </>
          )}
        </div>
      </div>
    </section>
  );
}
