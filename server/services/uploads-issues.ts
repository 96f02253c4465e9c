import { UPLOAD_MAX_ISSUES, type UploadIssue } from '../../shared/schemas/upload';

/** Collects the problems of one file; lists the first `UPLOAD_MAX_ISSUES`, counts them all, remembers rejected rows. */
export class IssueLog {
  readonly issues: UploadIssue[] = [];
  readonly rejectedRows = new Set<number>();
  total = 0;

  add(row: number, column: string | null, message: string): void {
    this.total++;
    if (row > 1) this.rejectedRows.add(row);
    if (this.issues.length < UPLOAD_MAX_ISSUES) this.issues.push({ row, column, message });
  }

  get truncated(): boolean {
    return this.total > this.issues.length;
  }
}

/** The whole file is refused (encoding, header, size, parse error): nothing is read further, nothing written. */
export class UploadRejected extends Error {
  constructor(
    readonly status: 413 | 422,
    message: string,
    readonly issues: UploadIssue[] = [{ row: 0, column: null, message }],
  ) {
    super(message);
  }
}
