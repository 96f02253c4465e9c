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

export type Cell = string | number;

/** One cell as it goes to csv-stringify: '' for missing, numbers as numbers, 0/1 for flags, text neutralised. */
export function cell(type: ColumnType, value: string | number | boolean | null | undefined): Cell {
  if (value === null || value === undefined) return '';
  switch (type) {
    case 'flag':
      return value ? 1 : 0;
    case 'integer':
    case 'number':
      return typeof value === 'number' && Number.isFinite(value) ? value : '';
    default:
      return neutralise(String(value));
  }
}

/** Rounds away floating-point noise (0.30000000000000004) without changing recorded precision. */
export const tidy = (x: number, decimals = 6) => Math.round(x * 10 ** decimals) / 10 ** decimals;
