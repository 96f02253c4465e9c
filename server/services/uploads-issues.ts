import { UPLOAD_MAX_ISSUES, type UploadIssue } from '../../shared/schemas/upload';

/**
 * Collects the problems of one file; lists the first `UPLOAD_MAX_ISSUES`, counts them all, remembers rejected rows.
 * The list shows the problems of reading rows first, then those found when planning (checks against what is
 * stored, across an episode's rows), whichever order they were found in: an upload plans chunks of episodes
 * while later rows are still being read.
 */
export class IssueLog {
  private readonly reading: UploadIssue[] = [];
  private readonly planned: UploadIssue[] = [];
  readonly rejectedRows = new Set<number>();
  total = 0;
  /** True while a chunk is being planned. */
  planning = false;

  add(row: number, column: string | null, message: string): void {
    this.total++;
    if (row > 1) this.rejectedRows.add(row);
    const list = this.planning ? this.planned : this.reading;
    if (list.length < UPLOAD_MAX_ISSUES) list.push({ row, column, message });
  }

  get issues(): UploadIssue[] {
    return [...this.reading, ...this.planned].slice(0, UPLOAD_MAX_ISSUES);
  }

  get truncated(): boolean {
    return this.total > Math.min(UPLOAD_MAX_ISSUES, this.reading.length + this.planned.length);
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
