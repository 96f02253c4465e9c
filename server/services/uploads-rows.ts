import { REPORTERS, TIMEPOINTS } from '../../shared/constants';
import type { Header } from './uploads-parse';
import type { UploadAssessment } from './uploads-validate';

/**
 * The accepted assessment rows of one file, held column by column in typed arrays until their chunk is
 * planned: about 70 bytes a row instead of some 250 as objects. The heap V8 lets grow before a full
 * collection is a multiple of what is alive, so 100,000 rows held as objects cost far more than their size.
 * Empty cells are NaN (scores and steps, which are finite numbers when accepted) or -1 (adverse events).
 */
export class RowStore {
  private size = 0;
  private capacity = 0;
  private rowNo = new Int32Array(0);
  private date = new Int32Array(0);
  private timepoint = new Uint8Array(0);
  private reporter = new Uint8Array(0);
  private steps = new Float64Array(0);
  private adverse = new Int32Array(0);
  private scores = new Float64Array(0);
  /** Dates and adverse-event codes: few distinct values, stored once. */
  private readonly texts: string[] = [];
  private readonly textIndex = new Map<string, number>();
  private readonly codes: string[];
  private readonly has: { reporter: boolean; steps: boolean; adverse: boolean };

  constructor(header: Header) {
    this.codes = header.columns.filter((c) => c.level === 'score').map((c) => c.field);
    this.has = { reporter: header.has.has('reporter'), steps: header.has.has('avg_daily_steps'), adverse: header.has.has('adverse_event') };
  }

  /** Stores a row; returns its index. */
  add(a: UploadAssessment): number {
    if (this.size === this.capacity) this.grow();
    const i = this.size++;
    this.rowNo[i] = a.row;
    this.date[i] = this.text(a.assessedOn);
    this.timepoint[i] = TIMEPOINTS.indexOf(a.timepoint);
    this.reporter[i] = a.reporter === undefined ? 0 : REPORTERS.indexOf(a.reporter);
    this.steps[i] = a.avgDailySteps ?? NaN;
    this.adverse[i] = a.adverseEvent == null ? -1 : this.text(a.adverseEvent);
    const k = this.codes.length;
    this.codes.forEach((code, j) => (this.scores[i * k + j] = a.scores[code] ?? NaN));
    return i;
  }

  /** The row as the planner reads it (`undefined` for a column the file does not have, `null` for an empty cell). */
  row(i: number): UploadAssessment {
    const scores: Record<string, number | null> = {};
    const k = this.codes.length;
    this.codes.forEach((code, j) => {
      const v = this.scores[i * k + j]!;
      scores[code] = Number.isNaN(v) ? null : v;
    });
    const steps = this.steps[i]!;
    return {
      row: this.rowNo[i]!,
      assessedOn: this.texts[this.date[i]!]!,
      timepoint: TIMEPOINTS[this.timepoint[i]!]!,
      reporter: this.has.reporter ? REPORTERS[this.reporter[i]!] : undefined,
      avgDailySteps: this.has.steps ? (Number.isNaN(steps) ? null : steps) : undefined,
      adverseEvent: this.has.adverse ? (this.adverse[i] === -1 ? null : this.texts[this.adverse[i]!]!) : undefined,
      scores,
    };
  }

  private text(s: string): number {
    let n = this.textIndex.get(s);
    if (n === undefined) {
      n = this.texts.push(s) - 1;
      this.textIndex.set(s, n);
    }
    return n;
  }

  private grow(): void {
    const cap = Math.max(1024, this.capacity * 2);
    const more = <T extends Int32Array | Uint8Array | Float64Array>(old: T, make: (n: number) => T, width = 1): T => {
      const next = make(cap * width);
      next.set(old);
      return next;
    };
    this.rowNo = more(this.rowNo, (n) => new Int32Array(n));
    this.date = more(this.date, (n) => new Int32Array(n));
    this.timepoint = more(this.timepoint, (n) => new Uint8Array(n));
    this.reporter = more(this.reporter, (n) => new Uint8Array(n));
    this.steps = more(this.steps, (n) => new Float64Array(n));
    this.adverse = more(this.adverse, (n) => new Int32Array(n));
    this.scores = more(this.scores, (n) => new Float64Array(n), this.codes.length);
    this.capacity = cap;
  }
}
