import type { UploadResult } from '../../../shared/schemas/upload';

const n = (v: number) => v.toLocaleString('en-GB');
/** "1 episode", "2 episodes". */
const count = (v: number, word: string) => `${n(v)} ${word}${v === 1 ? '' : 's'}`;

/** The counts of a check or a save and, when there are problems, every one of them by row and column. */
export function UploadReport({ result, fileName }: { result: UploadResult; fileName: string }) {
  const clean = result.rejected === 0 && result.errors.length === 0;
  const verb = result.dryRun ? 'Check of' : 'Saving';
  return (
    <section aria-labelledby="upload-report-heading" className="space-y-4">
      <h2 id="upload-report-heading" className="text-lg font-medium">
        {verb} “{fileName}”
      </h2>
      <dl className="flex flex-wrap gap-3">
        <div className="rounded border border-line bg-surface px-4 py-3">
          <dt className="text-xs uppercase tracking-wide text-ink-faint">Rows accepted</dt>
          <dd className="tabular text-2xl text-good">{n(result.accepted)}</dd>
        </div>
        <div className="rounded border border-line bg-surface px-4 py-3">
          <dt className="text-xs uppercase tracking-wide text-ink-faint">Rows rejected</dt>
          <dd className={`tabular text-2xl ${result.rejected ? 'text-bad' : 'text-ink'}`}>{n(result.rejected)}</dd>
        </div>
      </dl>
      <p role="status" className="text-sm">
        {clean
          ? result.dryRun
            ? 'Every row is valid. Nothing has been saved yet: submit the file to save it.'
            : 'The file was saved.'
          : 'Nothing was saved. Correct the rows below in your file and check it again.'}
      </p>
      {result.changes && clean ? (
        <p className="text-sm text-ink-soft">
          {result.dryRun ? 'Submitting would create' : 'Created'} {count(result.changes.episodesCreated, 'episode')} and{' '}
          {count(result.changes.assessmentsCreated, 'assessment')}, {result.dryRun ? 'update' : 'updated'}{' '}
          {count(result.changes.episodesUpdated, 'episode')} and{' '}
          {count(result.changes.assessmentsUpdated, 'assessment')}; {count(result.changes.rowsUnchanged, 'row')} already
          stored exactly as in the file.
        </p>
      ) : null}
      {result.errors.length > 0 ? (
        <div className="max-h-[28rem] overflow-auto rounded border border-line bg-surface">
          <table className="tabular w-full text-left text-sm">
            <caption className="sr-only">Problems found in the file</caption>
            <thead className="sticky top-0 border-b border-line bg-canvas text-xs text-ink-soft">
              <tr>
                <th scope="col" className="px-4 py-2 font-medium">
                  Row
                </th>
                <th scope="col" className="px-4 py-2 font-medium">
                  Column
                </th>
                <th scope="col" className="px-4 py-2 font-medium">
                  Problem
                </th>
              </tr>
            </thead>
            <tbody>
              {result.errors.map((e, i) => (
                <tr key={`${e.row}-${e.column ?? ''}-${i}`} className="border-b border-line last:border-0">
                  <td className="px-4 py-2 align-top">{e.row === 0 ? 'Whole file' : e.row}</td>
                  <td className="px-4 py-2 align-top font-mono text-xs">{e.column ?? '–'}</td>
                  <td className="px-4 py-2 align-top">{e.message}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {result.truncated ? (
        <p className="text-sm text-caution">
          Only the first {n(result.errors.length)} problems are listed; fix these and check again to see the rest.
        </p>
      ) : null}
    </section>
  );
}
