import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { stringify } from 'csv-stringify/sync';
import { parse } from 'csv-parse/sync';
import { exportColumns, REQUESTABLE_GROUPS, type ColumnType, type ExportColumn } from '../../shared/export-columns';
import { deriveContext, deriveFacts, type EpisodeFacts } from '../../server/services/cohorts/derive';
import { loadReference } from '../../server/services/cohorts/reference';
import { withSnapshot } from '../../server/services/cohorts/scan';
import { currentRules } from '../../server/services/rules.service';
import { columnContext } from '../../server/services/exports/columns';
import { cellFormatter, headerLine, neutralise } from '../../server/services/exports/csv-cell';
import { lineBuilder } from '../../server/services/exports/csv-line';
import { scanExportRows } from '../../server/services/exports/export-scan';
import { generalise, type Qi } from '../../server/services/exports/generalise';
import { clinicCoder, fieldGetter, PART, qiOf } from '../../server/services/exports/row';
import { testApp } from '../setup/test-app';
import { randomSpecs, seedDataset } from './exports-fixtures';

const ctx = testApp();
let facts: EpisodeFacts[];
let columns: ExportColumn[];

beforeAll(async () => {
  const data = await seedDataset(ctx.db, ['Line North', 'Line South'], randomSpecs(60, 2, 2024));
  const ids = new Set(data.episodes.map((e) => e.id));
  const [ref, { rules }] = await Promise.all([loadReference(ctx.db), currentRules(ctx.db)]);
  const derive = deriveContext(ref, rules);
  columns = exportColumns(
    [...REQUESTABLE_GROUPS],
    columnContext(ref, rules, { startGranularity: 'quarter', allowRawBmi: true, k: 5 }),
  );
  facts = await withSnapshot(ctx.db, async (client) => {
    const out: EpisodeFacts[] = [];
    for await (const rows of scanExportRows(client, { scores: true, interventions: true }))
      for (const r of rows) if (ids.has(r.id)) out.push(deriveFacts(r, derive));
    return out;
  });
});
afterAll(() => ctx.close());

/** How the export wrote a cell before it formatted its own lines: a value handed to csv-stringify per cell. */
function cellBefore(type: ColumnType, value: string | number | boolean | null): string | number {
  if (value === null) return '';
  if (type === 'flag') return value ? 1 : 0;
  if (type === 'integer' || type === 'number') return typeof value === 'number' && Number.isFinite(value) ? value : '';
  return neutralise(String(value));
}

/** The line as csv-stringify writes the record of the same values (the reference the export must match). */
function lineBefore(f: EpisodeFacts, q: Qi, coder: (id: number) => string): string {
  const record = columns.map((c) => {
    const s = c.source;
    if (s.kind === 'field') return cellBefore(c.type, fieldGetter(s.field, coder)(f, q));
    if (s.kind === 'intervention') return cellBefore(c.type, f.interventionCodes.has(s.code));
    const i = f.byInstrument.get(s.code);
    return cellBefore(c.type, i ? PART[s.part](i) : null);
  });
  return stringify([record]).slice(0, -1);
}

const ODD_TEXT = ['=SUM(A1)', '-cmd', 'a, b', 'say "hi"', 'two\nlines', '\tx', '@y', '+z', 'Zürich–Süd', ''];

describe('CSV lines of the export', () => {
  it('are byte for byte what csv-stringify writes for the same cells, generalised or not', () => {
    expect(facts.length).toBeGreaterThan(40);
    const coder = clinicCoder();
    const line = lineBuilder(columns, coder);
    let compared = 0;
    for (const [n, f] of facts.entries()) {
      const exact = qiOf(f, 'quarter');
      // Odd regions (formula starts, quotes, commas, line breaks) and every generalisation level.
      const q = generalise({ ...exact, region: ODD_TEXT[n % ODD_TEXT.length]! }, n % 6);
      const mine = line(f, q);
      const [id, ...rest] = parse(`${mine}\n`)[0] as string[];
      expect(id).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/);
      const before = lineBefore(f, q, coder);
      expect(mine.slice(id!.length), f.id.toString()).toBe(before.slice(before.indexOf(',')));
      expect(rest).toHaveLength(columns.length - 1);
      compared++;
    }
    expect(compared).toBe(facts.length);
  });

  it('encode text the same way past the values a column remembers', () => {
    const format = cellFormatter('text');
    for (let i = 0; i < 5000; i++) {
      const value = i % 2 ? `=v${i}, "${i}"` : `plain ${i}`;
      expect(format(value)).toBe(stringify([[neutralise(value)]]).slice(0, -1));
    }
    expect(format(null)).toBe('');
    expect(cellFormatter('integer')(-3)).toBe('-3');
    expect(cellFormatter('number')(Number.NaN)).toBe('');
    expect(cellFormatter('flag')(false)).toBe('0');
  });

  it('start with the header csv-stringify writes', () => {
    const names = columns.map((c) => c.name);
    expect(`${headerLine(names)}\n`).toBe(stringify([], { header: true, columns: names }));
  });
});
