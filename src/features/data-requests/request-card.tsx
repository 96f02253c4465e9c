import type { ReactNode } from 'react';
import { GROUP_LABELS } from '../../../shared/export-columns';
import type { DataRequest } from '../../../shared/schemas/data-request';
import { savedWhen } from '../cohorts/format';
import { dictionaryUrl, exportCsvUrl } from './download-links';
import { STATUS_CLASSES, STATUS_LABELS } from './labels';

/** One data request: what was asked, what was decided, and (for its requester, once approved) the downloads. */
export function RequestCard({
  request: r,
  showRequester,
  children,
}: {
  request: DataRequest;
  showRequester: boolean;
  children?: ReactNode;
}) {
  const last = r.exports[0];
  return (
    <article className="space-y-2 rounded border border-line bg-surface p-4" aria-label={`Request ${r.id}`}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="font-medium">
          #{r.id} · {r.cohortName} <span className="text-sm font-normal text-ink-faint">version {r.cohortVersion}</span>
        </h3>
        <span className={`rounded border px-2 py-0.5 text-xs ${STATUS_CLASSES[r.status]}`}>
          {STATUS_LABELS[r.status]}
        </span>
      </div>
      <p className="text-xs text-ink-faint">
        {showRequester ? `${r.requester.name || r.requester.email} · ` : ''}asked {savedWhen(r.createdAt)}
      </p>
      <p className="text-sm">{r.purpose}</p>
      <p className="text-xs text-ink-soft">
        Variables: {r.variableGroups.map((g) => GROUP_LABELS[g].split(' (')[0]).join('; ')}
      </p>
      {r.status === 'approved' ? (
        <p className="text-xs text-ink-soft">
          Until {r.expiresOn} · start dates by {r.startGranularity} · k = {r.k} · raw BMI{' '}
          {r.allowRawBmi ? 'included' : 'not included'}
        </p>
      ) : null}
      {r.status === 'declined' ? <p className="text-sm text-bad">Reason: {r.declineReason}</p> : null}
      {r.status === 'approved' && r.mine && !r.downloadable ? (
        <p className="text-sm text-ink-soft">The download period has ended.</p>
      ) : null}
      {r.downloadable ? (
        <div className="flex flex-wrap gap-4 text-sm">
          <a href={exportCsvUrl(r.id)} className="font-medium text-accent hover:underline" download>
            Download the CSV
          </a>
          <a href={dictionaryUrl(r.id, 'md')} className="text-accent hover:underline" download>
            Data dictionary (Markdown)
          </a>
          <a href={dictionaryUrl(r.id, 'csv')} className="text-accent hover:underline" download>
            Data dictionary (CSV)
          </a>
        </div>
      ) : null}
      {last ? (
        <p className="text-xs text-ink-faint">
          Last export {savedWhen(last.finishedAt)}: {last.rowCount} rows, {last.generalisedRows} generalised and{' '}
          {last.suppressedRows} left out for k-anonymity ({r.exports.length} in all).
        </p>
      ) : null}
      {children}
    </article>
  );
}
