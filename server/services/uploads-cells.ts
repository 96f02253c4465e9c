import type { InterventionInput } from '../../shared/schemas/episode';
import type { UploadColumn } from '../../shared/upload-columns';

/** Why a cell could not be read. A cell that reads returns its value itself: no wrapper object per cell. */
export class CellProblem {
  constructor(readonly message: string) {}
}

const NUMBER = /^[+-]?(\d+(\.\d+)?|\.\d+)$/;
const INTEGER = /^[+-]?\d+$/;
const TRUE = new Set(['yes', 'y', 'true', '1']);
const FALSE = new Set(['no', 'n', 'false', '0']);
const INTERVENTION = /^([a-z0-9][a-z0-9-]*)(?:@(\d{1,3}))?(?::(\d))?$/;

/**
 * Spreadsheet programs run a cell that starts with = + - @ (or a tab or carriage return) as a formula
 * (OWASP "CSV injection"). Text never legitimately starts so here; numbers may carry a sign.
 */
export function looksLikeFormula(raw: string): boolean {
  return /^[=+\-@\t\r]/.test(raw);
}

const FORMULA = 'starts with = + - or @ like a spreadsheet formula; remove that character (the registry stores no formulas)';

// Clinics reuse a handful of intervention lists: each distinct cell is read once, and episodes share the
// (never modified) result instead of holding their own copies of the same small objects.
const LISTS = new Map<string, unknown>();
function interventions(raw: string): unknown {
  let cell = LISTS.get(raw);
  if (cell === undefined) {
    if (LISTS.size > 5_000) LISTS.clear();
    cell = readInterventions(raw);
    LISTS.set(raw, cell);
  }
  return cell;
}

function readInterventions(raw: string): unknown {
  const out: InterventionInput[] = [];
  for (const part of raw.split(';').map((p) => p.trim()).filter((p) => p !== '')) {
    if (looksLikeFormula(part)) return new CellProblem(`“${part}” ${FORMULA}`);
    const m = INTERVENTION.exec(part.toLowerCase());
    if (!m) return new CellProblem(`“${part}” is not an intervention; write code, code:level or code@week:level`);
    const level = m[3] === undefined ? null : Number(m[3]);
    if (level !== null && (level < 1 || level > 3)) return new CellProblem(`“${part}”: a level is 1, 2 or 3`);
    out.push({ code: m[1]!, startWeek: m[2] === undefined ? 0 : Number(m[2]), maxLevel: level });
  }
  return out;
}

// Dates repeat across rows (a few hundred distinct days): keep one copy of each.
const INTERNED = new Map<string, string>();
function intern(s: string): string {
  const known = INTERNED.get(s);
  if (known !== undefined) return known;
  if (INTERNED.size > 50_000) INTERNED.clear();
  INTERNED.set(s, s);
  return s;
}

/**
 * Reads one cell of `col`: its value, or a CellProblem. Cells are trimmed; an empty cell is `undefined`
 * (required cells are checked by the caller).
 */
export function readCell(col: UploadColumn, raw: string): unknown {
  const s = raw.trim();
  if (s === '') return undefined;
  switch (col.type) {
    case 'integer':
    case 'number': {
      if (!(col.type === 'integer' ? INTEGER : NUMBER).test(s)) {
        if (/^[=@]/.test(s) || (looksLikeFormula(s) && !NUMBER.test(s))) return new CellProblem(`The cell ${FORMULA}`);
        return new CellProblem(
          col.type === 'integer' ? `Use a whole number (not “${s.slice(0, 20)}”)` : `Use a number like 74.5, with a point for decimals and no units (not “${s.slice(0, 20)}”)`,
        );
      }
      return Number(s);
    }
    case 'boolean': {
      if (looksLikeFormula(s)) return new CellProblem(`The cell ${FORMULA}`);
      const v = s.toLowerCase();
      if (TRUE.has(v)) return true;
      if (FALSE.has(v)) return false;
      return new CellProblem(`Use yes or no (not “${s.slice(0, 20)}”)`);
    }
    case 'enum': {
      if (looksLikeFormula(s)) return new CellProblem(`The cell ${FORMULA}`);
      // The constant itself, not the cell's copy: 100,000 rows then share one string per value.
      const v = col.values!.find((x) => x === s.toLowerCase());
      if (v === undefined) return new CellProblem(`Use one of: ${col.values!.join(', ')} (not “${s.slice(0, 20)}”)`);
      return v;
    }
    case 'interventions':
      return interventions(s);
    case 'date':
      if (looksLikeFormula(s)) return new CellProblem(`The cell ${FORMULA}`);
      return intern(s);
    default:
      if (looksLikeFormula(s)) return new CellProblem(`The cell ${FORMULA}`);
      return s;
  }
}
