import { stringify } from 'csv-stringify/sync';
import type { ExportColumn } from '../../../shared/export-columns';
import type { Db } from '../../db/client';
import type { Scope } from '../../db/scope';
import { currentRules } from '../rules.service';
import { loadReference } from '../cohorts/reference';
import { neutralise } from './csv-cell';
import { authoriseDownload } from './data-requests.service';
import { columnsFor } from './columns';

export type Dictionary = { filename: string; contentType: string; body: string };

const HEADER = ['name', 'group', 'type', 'unit', 'allowed values', 'how derived', 'quasi-identifier'];
const rowOf = (c: ExportColumn) => [
  c.name,
  c.group,
  c.type,
  c.unit,
  c.allowed,
  c.derivation,
  c.quasiIdentifier ? 'yes' : 'no',
];

const mdCell = (s: string) => s.replace(/\|/g, '\\|').replace(/\r?\n/g, ' ');

function markdown(requestId: number, k: number, columns: readonly ExportColumn[]): string {
  const lines = [
    `# Data dictionary — Loadline data request #${requestId}`,
    '',
    'One row per episode of care. No names, clinic names, episode references, pseudonyms, calendar dates, height or',
    'weight are exported; times are days or weeks since the episode started. Study ids and site codes are drawn anew',
    `for every export, so two exports cannot be joined. Every combination of the quasi-identifiers is shared by at least`,
    `${k} rows: rarer combinations are generalised (wider age band, start year, BMI band or region '*') or left out.`,
    'Text cells that begin with = + - @, a tab or a carriage return are prefixed with a single quote; numeric columns',
    'are plain numbers (a negative change is a number, not text).',
    '',
    `| ${HEADER.join(' | ')} |`,
    `| ${HEADER.map(() => '---').join(' | ')} |`,
    ...columns.map((c) => `| ${rowOf(c).map(mdCell).join(' | ')} |`),
    '',
    'Associations in registry data are observational and confounded by who received which care; they are not',
    'evidence of cause. Use the data only for the purpose approved, and never attempt to re-identify anyone.',
    '',
  ];
  return lines.join('\n');
}

/** The data dictionary of a request, generated from the same column definition as the CSV itself. */
export async function requestDictionary(
  db: Db,
  scope: Scope,
  requestId: number,
  format: 'csv' | 'md',
): Promise<Dictionary> {
  const grant = await authoriseDownload(db, scope, requestId);
  const [ref, { rules }] = await Promise.all([loadReference(db), currentRules(db)]);
  const columns = columnsFor(ref, rules, grant);
  const base = `loadline-request-${requestId}-dictionary`;
  if (format === 'md')
    return {
      filename: `${base}.md`,
      contentType: 'text/markdown; charset=utf-8',
      body: markdown(requestId, grant.k, columns),
    };
  const body = stringify([HEADER, ...columns.map((c) => rowOf(c).map(neutralise))]);
  return { filename: `${base}.csv`, contentType: 'text/csv; charset=utf-8', body };
}
