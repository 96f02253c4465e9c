import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { UploadResult } from '../../shared/schemas/upload';
import { UPLOAD_MAX_BYTES } from '../../shared/upload-columns';
import { ErrorNotice } from '../components/error-notice';
import { paths } from '../config/paths';
import { UPLOAD_TEMPLATE_URL } from '../features/uploads/api/list-uploads';
import { useUploadEpisodes } from '../features/uploads/api/upload-episodes';
import { PastUploads } from '../features/uploads/past-uploads';
import { UploadReport } from '../features/uploads/upload-report';

const buttonBase = 'rounded px-4 py-2 text-sm font-medium disabled:cursor-not-allowed disabled:opacity-50';

/** CSV upload: check the file first (nothing is written), then submit it once the check is clean. */
export function Component() {
  const [file, setFile] = useState<File | null>(null);
  // The last answer and the file it belongs to: Submit unlocks only for a clean check of this very file.
  const [answer, setAnswer] = useState<{ file: File; result: UploadResult } | null>(null);
  const upload = useUploadEpisodes();
  const current = answer && answer.file === file ? answer.result : null;
  const checkedClean = current !== null && current.dryRun && current.rejected === 0 && current.errors.length === 0 && current.accepted > 0;

  const send = (dryRun: boolean) => {
    if (!file) return;
    upload.mutate({ file, dryRun }, { onSuccess: (result) => setAnswer({ file, result }) });
  };

  return (
    <section className="max-w-5xl space-y-8">
      <header className="space-y-1">
        <h1 className="text-2xl font-semibold">Upload episodes from a file</h1>
        <p className="text-sm text-ink-soft">
          One row per assessment, in the columns of the template. Check the file first: nothing is saved until you
          submit a file that passed the check, and then every row is saved or none is.
        </p>
        <p className="text-sm">
          <a href={UPLOAD_TEMPLATE_URL} download className="text-accent hover:underline">
            Download the template (CSV)
          </a>
          <span className="text-ink-faint"> · pseudonyms are made at the clinic, never names or local numbers · </span>
          <Link to={paths.episodes} className="text-accent hover:underline">
            Back to the caseload
          </Link>
        </p>
      </header>

      <div className="space-y-4 rounded border border-line bg-surface p-5">
        <div className="space-y-1">
          <label htmlFor="upload-file" className="block text-sm font-medium">
            CSV file
          </label>
          <p id="upload-file-hint" className="text-xs text-ink-faint">
            A .csv file (or .csv.gz), at most {UPLOAD_MAX_BYTES / 1024 / 1024} MiB.
          </p>
          <input
            id="upload-file"
            type="file"
            accept=".csv,.gz,text/csv"
            aria-describedby="upload-file-hint"
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              upload.reset();
            }}
            className="block text-sm file:mr-3 file:rounded file:border file:border-line file:bg-canvas file:px-3 file:py-1.5"
          />
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <button type="button" onClick={() => send(true)} disabled={!file || upload.isPending} className={`${buttonBase} border border-accent text-accent-strong hover:bg-accent-tint`}>
            {upload.isPending && upload.variables?.dryRun ? 'Checking…' : 'Check file'}
          </button>
          <button type="button" onClick={() => send(false)} disabled={!checkedClean || upload.isPending} className={`${buttonBase} bg-accent text-white hover:bg-accent-strong`}>
            {upload.isPending && upload.variables?.dryRun === false ? 'Saving…' : 'Submit'}
          </button>
          {!checkedClean ? <span className="text-xs text-ink-faint">Submit opens after a check with no problems.</span> : null}
        </div>
      </div>

      {upload.error ? <ErrorNotice error={upload.error} title="The file could not be sent" /> : null}
      {current && file ? <UploadReport result={current} fileName={file.name} /> : null}

      <section aria-labelledby="past-uploads-heading" className="space-y-3">
        <h2 id="past-uploads-heading" className="text-lg font-medium">
          Earlier uploads
        </h2>
        <PastUploads />
      </section>
    </section>
  );
}
