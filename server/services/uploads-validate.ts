import { z } from 'zod';
import { DISCHARGE_REASONS, EPISODE_STATUSES, type Timepoint } from '../../shared/constants';
import { AssessmentInputSchema, EpisodeCreateSchema, IsoDateSchema, type InterventionInput } from '../../shared/schemas/episode';
import { UPLOAD_COLUMNS } from '../../shared/upload-columns';
import type { IssueLog } from './uploads-issues';
import type { Header } from './uploads-parse';
import { CellProblem, readCell } from './uploads-cells';
import { RowStore } from './uploads-rows';
import { scoreProblems } from './reference-checks';
import type { ReferenceData } from './reference.service';

/** The episode columns of a row, checked with the same shared schema as the episode form. */
export const UploadEpisodeSchema = EpisodeCreateSchema.omit({ baseline: true, interventions: true }).extend({
  status: z.enum(EPISODE_STATUSES).default('open'),
  dischargeDate: IsoDateSchema.nullable().default(null),
  dischargeReason: z.enum(DISCHARGE_REASONS).nullable().default(null),
});
export type UploadEpisodeFields = z.infer<typeof UploadEpisodeSchema>;

/** One assessment row. `undefined` = the column is not in the file (keep what is stored); `null` = an empty cell. */
export type UploadAssessment = {
  row: number;
  assessedOn: string;
  timepoint: Timepoint;
  reporter: 'clinician' | 'patient' | undefined;
  avgDailySteps: number | null | undefined;
  adverseEvent: string | null | undefined;
  scores: Record<string, number | null>;
};

/** All rows of one episode reference in the file; `fields` is null when the episode columns are not valid. */
export type ReadEpisode = {
  reference: string;
  firstRow: number;
  /** The first row's episode cells as written (a later row that differs is compared as read: "Yes" = "yes"); null once read. */
  rawCells: string[] | null;
  fields: UploadEpisodeFields | null;
  interventions: InterventionInput[] | undefined;
  /** The episode's accepted rows, as indices into the file's RowStore (a file read whole)... */
  rowIds: number[];
  /** ...or as objects (a file read as it is written, where only a chunk's rows are alive at a time). */
  rows: UploadAssessment[] | undefined;
};
/** An episode as the planner reads it: its rows as objects (made chunk by chunk from the RowStore). */
export type UploadEpisode = Omit<ReadEpisode, 'rawCells' | 'rowIds' | 'rows'> & { rows: UploadAssessment[] };

const COLUMN_OF_FIELD = new Map(UPLOAD_COLUMNS.filter((c) => c.level !== 'score').map((c) => [c.field, c.name]));
const COLUMN_OF_SCORE = new Map(UPLOAD_COLUMNS.filter((c) => c.level === 'score').map((c) => [c.field, c.name]));

/** An assessment row with its date checked apart (below), against the same shared schema. */
const RowAssessmentSchema = AssessmentInputSchema.extend({ assessedOn: z.string() });
const DATE_ISSUES = new Map<string, z.core.$ZodIssue[]>();
/** The shared date schema's issues for a date; dates repeat across rows (a few hundred days), so each is checked once. */
function dateIssues(s: string): z.core.$ZodIssue[] {
  let issues = DATE_ISSUES.get(s);
  if (issues === undefined) {
    if (DATE_ISSUES.size > 20_000) DATE_ISSUES.clear();
    const r = IsoDateSchema.safeParse(s);
    issues = r.success ? [] : r.error.issues;
    DATE_ISSUES.set(s, issues);
  }
  return issues;
}

/** Zod's default range messages, said plainly; the shared schemas' own messages are kept as they are. */
function plain(issue: z.core.$ZodIssue): string {
  const i = issue as { code: string; minimum?: unknown; maximum?: unknown; message: string };
  if (i.code === 'too_small' && /^Too small/.test(i.message)) return `Must be at least ${String(i.minimum)}`;
  if (i.code === 'too_big' && /^Too big/.test(i.message)) return `Must be at most ${String(i.maximum)}`;
  return i.message;
}

/** Reads rows one at a time into episodes; problems go to the log with their row and column. */
export class RowCollector {
  readonly episodes = new Map<string, ReadEpisode>();
  private refIndex = -1;
  private rowStore: RowStore | undefined;

  /** `asObjects`: keep each episode's rows as objects instead of in one RowStore for the whole file. */
  constructor(
    private readonly log: IssueLog,
    private readonly ref: ReferenceData,
    private readonly asObjects = false,
  ) {}

  /** The accepted rows (undefined until a row is read). */
  get store(): RowStore | undefined {
    return this.rowStore;
  }

  add(cells: string[], row: number, header: Header): void {
    if (this.refIndex < 0) this.refIndex = header.columns.findIndex((c) => c?.name === 'episode_reference');
    this.episodeCells ??= header.columns.flatMap((c, i) => (c.level === 'episode' ? [i] : []));
    const reference = cells[this.refIndex]!.trim();
    const known = this.episodes.get(reference);
    // Fast path: a row repeating its episode's first row exactly needs no second reading of the episode columns.
    const repeat = known !== undefined && known.rawCells !== null && this.sameEpisodeCells(known.rawCells, cells);
    const epi: Record<string, unknown> | null = repeat ? null : {};
    const asm: Record<string, unknown> = {};
    const scoreCells: Record<string, number | null> = {};
    let bad: Set<string> | null = null; // fields whose cells could not be read
    const columns = header.columns;
    for (let i = 0; i < columns.length; i++) {
      const col = columns[i]!;
      if (repeat && col.level === 'episode') continue;
      const value = readCell(col, cells[i]!);
      if (value instanceof CellProblem) {
        this.log.add(row, col.name, value.message);
        (bad ??= new Set()).add(col.field);
        continue;
      }
      if (value === undefined && col.required) {
        this.log.add(row, col.name, `Enter a value for ${col.name} (a required column)`);
        (bad ??= new Set()).add(col.field);
        continue;
      }
      if (col.level === 'episode') epi![col.field] = value;
      else if (col.level === 'assessment') asm[col.field] = value;
      else scoreCells[col.field] = (value as number | undefined) ?? null;
    }
    if (bad) {
      // The row is refused, but its readable cells are still checked, so one pass reports all of its problems.
      this.checkAssessment(row, asm, scoreCells, bad);
      return;
    }
    if (!reference) return;
    const group = repeat ? (known.fields ? known : null) : this.episodeOf(reference, cells, epi!, row, header);
    if (!group) {
      this.log.rejectedRows.add(row); // its episode's columns are not valid (reported on the episode's first row)
      return;
    }
    const parsed = this.checkAssessment(row, asm, scoreCells, null);
    if (!parsed) return;
    const accepted: UploadAssessment = {
      row,
      assessedOn: parsed.assessedOn,
      timepoint: parsed.timepoint,
      reporter: header.has.has('reporter') ? parsed.reporter : undefined,
      avgDailySteps: header.has.has('avg_daily_steps') ? (parsed.avgDailySteps ?? null) : undefined,
      adverseEvent: header.has.has('adverse_event') ? parsed.adverseEvent || null : undefined,
      scores: scoreCells,
    };
    if (group.rows) group.rows.push(accepted);
    else group.rowIds.push((this.rowStore ??= new RowStore(header)).add(accepted));
  }

  /**
   * The assessment cells of a row against the shared schema and the instruments' ranges; every problem goes to
   * the log. `unreadable`: fields whose cells were already reported (their follow-on issues are not repeated).
   * Returns the parsed assessment when the row has no problem at all.
   */
  private checkAssessment(
    row: number,
    asm: Record<string, unknown>,
    scoreCells: Record<string, number | null>,
    unreadable: Set<string> | null,
  ) {
    const scores: Record<string, number> = {};
    for (const code in scoreCells) if (scoreCells[code] !== null) scores[code] = scoreCells[code]!;
    const dateProblems = typeof asm.assessedOn === 'string' ? dateIssues(asm.assessedOn) : null;
    for (const issue of dateProblems ?? []) this.log.add(row, 'assessed_on', plain(issue));
    const schema = dateProblems ? RowAssessmentSchema : AssessmentInputSchema;
    asm.scores = scores; // `asm` is this row's own object: completed in place, not copied
    asm.avgDailySteps ??= null;
    asm.adverseEvent ??= null;
    const parsed = schema.safeParse(asm);
    let ok = unreadable === null && !(dateProblems && dateProblems.length > 0);
    if (!parsed.success) {
      ok = false;
      for (const issue of parsed.error.issues) {
        const [head, code] = issue.path as string[];
        if (unreadable?.has(head === 'scores' && code !== undefined ? code : head!)) continue;
        if (head === 'scores' && code === undefined) {
          if (!unreadable || ![...unreadable].some((f) => COLUMN_OF_SCORE.has(f)))
            this.log.add(row, null, 'Enter at least one score (a score_… column)');
        } else this.log.add(row, head === 'scores' ? (COLUMN_OF_SCORE.get(code!) ?? null) : (COLUMN_OF_FIELD.get(head!) ?? null), plain(issue));
      }
    }
    const problems = scoreProblems(scores, this.ref);
    for (const p of problems) this.log.add(row, COLUMN_OF_SCORE.get(p.field) ?? null, p.message);
    return ok && parsed.success && problems.length === 0 ? parsed.data : null;
  }

  /** Positions of the episode columns. */
  private episodeCells: number[] | undefined;
  /** Whether a row's episode cells are exactly an episode's first row's (compared cell by cell: nothing to build). */
  private sameEpisodeCells(first: string[], cells: string[]): boolean {
    const at = this.episodeCells!;
    for (let k = 0; k < at.length; k++) if (first[k] !== cells[at[k]!]) return false;
    return true;
  }

  /** The episode a row belongs to; every row must repeat the first row's episode columns exactly. */
  private episodeOf(reference: string, cells: string[], epi: Record<string, unknown>, row: number, header: Header): ReadEpisode | null {
    const known = this.episodes.get(reference);
    if (known) {
      // Both rows' episode cells as read (so "Yes" = "yes"); every cell of this row did read (else it was refused).
      const key = this.convertedKey(this.episodeCells!.map((i) => cells[i]!), header);
      const first = this.convertedKey(known.rawCells ?? [], header);
      if (first !== key) this.reportConflict(known, first, key, row, header);
      return first === key && known.fields ? known : null;
    }
    const rawCells = this.episodeCells!.map((i) => cells[i]!);
    const group: ReadEpisode = { reference, firstRow: row, rawCells, fields: null, interventions: undefined, rowIds: [], rows: this.asObjects ? [] : undefined };
    this.episodes.set(reference, group);
    const { interventions, ...fields } = epi;
    const parsed = UploadEpisodeSchema.safeParse(fields);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) this.log.add(row, COLUMN_OF_FIELD.get(String(issue.path[0])) ?? null, plain(issue));
      return null;
    }
    group.fields = parsed.data;
    group.interventions = interventions as InterventionInput[] | undefined;
    return group;
  }

  /** A row's episode cells (in header order), read as cells are read: compared only when a later row differs from the first. */
  private convertedKey(raw: string[], header: Header): string {
    const parts: string[] = [];
    let k = 0;
    header.columns.forEach((col, i) => {
      if (col.level !== 'episode') return;
      const cell = readCell(col, raw[k++] ?? '');
      const v = cell instanceof CellProblem ? raw[k - 1] : cell;
      parts[i] = v === undefined ? '' : typeof v === 'object' ? JSON.stringify(v) : String(v);
    });
    return parts.join('\u001f');
  }

  private reportConflict(known: ReadEpisode, firstKey: string, key: string, row: number, header: Header): void {
    const a = firstKey.split('\u001f');
    const b = key.split('\u001f');
    header.columns.forEach((col, i) => {
      if (col.level === 'episode' && a[i] !== b[i]) {
        this.log.add(row, col.name, `Episode “${known.reference}” has ${col.name} “${a[i]}” on row ${known.firstRow} but “${b[i]}” here; the episode columns must be the same on every row of an episode`);
      }
    });
  }
}
