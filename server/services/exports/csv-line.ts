import { randomUUID } from 'node:crypto';
import type { ExportColumn } from '../../../shared/export-columns';
import type { EpisodeFacts } from '../cohorts/derive';
import { cellFormatter } from './csv-cell';
import type { Qi } from './generalise';
import { fieldGetter, PART, QI_FIELDS } from './row';

/** A run of adjacent columns written by one function: their cells, joined with commas. */
type Part = (f: EpisodeFacts, q: Qi) => string;
type Run = { key: string; columns: ExportColumn[] };

/** What a column reads: runs of adjacent columns reading the same thing are written together. */
function runKey(c: ExportColumn): string {
  const s = c.source;
  if (s.kind === 'field') return QI_FIELDS.has(s.field) ? 'qi' : `field ${s.field}`;
  return s.kind === 'instrument' ? `instrument ${s.code}` : 'intervention';
}

function runsOf(columns: readonly ExportColumn[]): Run[] {
  const runs: Run[] = [];
  for (const c of columns) {
    const key = runKey(c);
    const last = runs[runs.length - 1];
    if (last && last.key === key && !key.startsWith('field ')) last.columns.push(c);
    else runs.push({ key, columns: [c] });
  }
  return runs;
}

type FieldColumn = ExportColumn & { source: { kind: 'field' } };

function fieldPart(c: FieldColumn, clinicCode: (id: number) => string): Part {
  // A UUID is lower-case hex and hyphens: nothing to quote or neutralise, and never worth remembering.
  if (c.source.field === 'study_id') return () => randomUUID();
  const get = fieldGetter(c.source.field, clinicCode);
  const format = cellFormatter(c.type);
  return (f, q) => format(get(f, q));
}

/** The quasi-identifier cells depend on the row's exported combination only: written once per combination. */
function qiPart(columns: readonly ExportColumn[], clinicCode: (id: number) => string): Part {
  const cells = columns.map((c) => fieldPart(c as FieldColumn, clinicCode));
  const written = new Map<Qi, string>();
  return (f, q) => {
    let text = written.get(q);
    if (text === undefined) {
      text = cells.map((cell) => cell(f, q)).join(',');
      written.set(q, text);
    }
    return text;
  };
}

/** The columns of one instrument side by side: one look-up of its facts for all of them. */
function instrumentPart(columns: readonly ExportColumn[], code: string): Part {
  const cells = columns.map((c) => {
    const part = PART[(c.source as { part: keyof typeof PART }).part];
    const format = cellFormatter(c.type);
    return (i: Parameters<typeof part>[0]) => format(part(i));
  });
  const missing = ','.repeat(cells.length - 1); // every cell empty when the instrument was never scored
  return (f) => {
    const i = f.byInstrument.get(code);
    if (!i) return missing;
    let text = cells[0]!(i);
    for (let k = 1; k < cells.length; k++) text += `,${cells[k]!(i)}`;
    return text;
  };
}

/** The 0/1 columns of the interventions received. */
function interventionPart(columns: readonly ExportColumn[]): Part {
  const codes = columns.map((c) => (c.source as { code: string }).code);
  return (f) => {
    const got = f.interventionCodes;
    let text = got.has(codes[0]!) ? '1' : '0';
    for (let k = 1; k < codes.length; k++) text += got.has(codes[k]!) ? ',1' : ',0';
    return text;
  };
}

/**
 * Compiles the columns, once per export, into one function from an episode (and its exported quasi-identifiers)
 * to its finished CSV line (without the line break). Adjacent columns that read the same thing are written by one
 * function, the pieces go into one reused array and are joined into a flat string: no per-row record objects,
 * and no string ropes kept alive until the chunk is written. (Writing every cell into one array instead made
 * less garbage but cost a fifth more time.)
 */
export function lineBuilder(columns: readonly ExportColumn[], clinicCode: (id: number) => string) {
  const parts: Part[] = runsOf(columns).map(({ key, columns: run }) => {
    const first = run[0]!;
    if (key === 'qi') return qiPart(run, clinicCode);
    if (key === 'intervention') return interventionPart(run);
    if (first.source.kind === 'instrument') return instrumentPart(run, first.source.code);
    return fieldPart(first as FieldColumn, clinicCode);
  });
  const pieces: string[] = parts.map(() => '');
  return (f: EpisodeFacts, q: Qi): string => {
    for (let i = 0; i < parts.length; i++) pieces[i] = parts[i]!(f, q);
    return pieces.join(',');
  };
}
