import { stringify } from 'csv-stringify/sync';
import type { ColumnType } from '../../../shared/export-columns';

/** First characters that make a spreadsheet read a cell as a formula (or hide one behind a tab or line break). */
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * Neutralises a text cell against formula injection by prefixing a single quote. Only text cells are touched:
 * numeric columns are written as numbers (a negative change such as -3 is a number, not a formula), so their
 * values stay usable in analysis software. (csv-stringify's own `escape_formulas` option would also prefix
 * every negative number, which is why the export does this per column type instead.)
 */
export function neutralise(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** Rounds away floating-point noise (0.30000000000000004) without changing recorded precision. */
export const tidy = (x: number, decimals = 6) => Math.round(x * 10 ** decimals) / 10 ** decimals;

export type CellValue = string | number | boolean | null | undefined;
/** One value to its finished CSV text (quoted where needed), ready to be joined with commas. */
export type CellFormatter = (value: CellValue) => string;

/** A text cell as csv-stringify writes it (quoted and escaped only where it must be), neutralised first. */
const encodeText = (text: string): string => stringify([[neutralise(text)]]).slice(0, -1);

/**
 * Distinct values one text column remembers. Export text is mostly a handful of codes and bands, so nearly every
 * cell is a lookup; past the limit a value is encoded afresh each time, so free text can never grow memory.
 */
const REMEMBERED = 4096;

function textFormatter(): CellFormatter {
  const known = new Map<string, string>();
  return (value) => {
    if (value === null || value === undefined) return '';
    const text = String(value);
    let csv = known.get(text);
    if (csv === undefined) {
      csv = encodeText(text);
      if (known.size < REMEMBERED) known.set(text, csv);
    }
    return csv;
  };
}

/**
 * The formatter of one column, made once per export: '' for missing, numbers as csv-stringify casts them
 * (`'' + n`, never quoted: digits, '-', '.', 'e' and '+' need none), 0/1 for flags, text neutralised and encoded
 * by csv-stringify (once per distinct value). Calling csv-stringify for every cell of a 60-column export cost
 * about half a microsecond a cell, most of the export's time; the file is byte for byte the same.
 */
export function cellFormatter(type: ColumnType): CellFormatter {
  switch (type) {
    case 'flag':
      return (v) => (v === null || v === undefined ? '' : v ? '1' : '0');
    case 'integer':
    case 'number':
      return (v) => (typeof v === 'number' && Number.isFinite(v) ? `${v}` : '');
    default:
      return textFormatter();
  }
}

/** The header line (without its line break), encoded by csv-stringify like every text cell. */
export const headerLine = (names: readonly string[]): string => stringify([names]).slice(0, -1);
