import { CsvError, parse } from 'csv-parse/sync';
import { UPLOAD_COLUMNS, UPLOAD_MAX_ROWS, type UploadColumn } from '../../shared/upload-columns';
import type { UploadIssue } from '../../shared/schemas/upload';
import { UploadRejected, type IssueLog } from './uploads-issues';

/** The header as read: each position's column, and which columns the file has. */
export type Header = { columns: UploadColumn[]; has: Set<string> };

const BY_NAME = new Map(UPLOAD_COLUMNS.map((c) => [c.name, c]));
const TEMPLATE = 'the template (GET /api/uploads/template.csv) lists every column';

/** Checks the header row: known columns, each once, every required one present, commas between them. */
export function readHeader(cells: string[]): Header {
  const issues: UploadIssue[] = [];
  const add = (column: string | null, message: string) => issues.push({ row: 1, column, message });
  if (cells.length === 1) {
    const sep = [';', '\t', '|'].find((d) => cells[0]!.includes(d));
    if (sep) {
      const name = sep === '\t' ? 'tabs' : `“${sep}”`;
      throw new UploadRejected(422, `The file is separated by ${name}, not commas; save it as CSV with commas between the columns`);
    }
  }
  const columns: UploadColumn[] = [];
  const firstAt = new Map<string, number>();
  cells.forEach((raw, i) => {
    const name = raw.trim().toLowerCase();
    if (name === '') return add(null, `Column ${i + 1} of the header has no name`);
    const col = BY_NAME.get(name);
    if (!col) return add(name, `Unknown column “${raw.trim()}”; ${TEMPLATE}`);
    if (firstAt.has(name)) return add(name, `The column “${name}” appears twice in the header (columns ${firstAt.get(name)! + 1} and ${i + 1})`);
    firstAt.set(name, i);
    columns[i] = col;
  });
  for (const c of UPLOAD_COLUMNS) {
    if (c.required && !firstAt.has(c.name)) add(c.name, `The required column “${c.name}” is missing; ${TEMPLATE}`);
  }
  if (issues.length > 0) {
    throw new UploadRejected(422, issues.length === 1 ? issues[0]!.message : 'The header row has problems; nothing was read', issues);
  }
  return { columns, has: new Set(firstAt.keys()) };
}

/**
 * Parses the CSV text in one pass, handing each data row to `onRow` as soon as it is read (no copy of the
 * whole file as records). Row numbers are file lines (header = 1), as a spreadsheet shows them.
 */
export function parseRows(text: Buffer, log: IssueLog, onRow: (cells: string[], row: number, header: Header) => void): { header: Header; rows: number } {
  let header: Header | undefined;
  let width = 0;
  let rows = 0;
  try {
    parse(text, {
      bom: true,
      relax_column_count: true,
      skip_empty_lines: true,
      max_record_size: 64 * 1024,
      on_record: (record: string[], ctx) => {
        if (!header) {
          header = readHeader(record);
          width = record.length;
          return null;
        }
        if (record.every((c) => c.trim() === '')) return null; // a spreadsheet's trailing ",,,," line
        rows++;
        if (rows > UPLOAD_MAX_ROWS) return null; // keep counting only; refused below
        if (record.length !== width) {
          log.add(ctx.lines, null, `This row has ${record.length} cells but the header has ${width} (a comma too many or too few, or a quote left open?)`);
          return null;
        }
        onRow(record, ctx.lines, header);
        return null;
      },
    });
  } catch (e) {
    if (e instanceof UploadRejected) throw e;
    if (e instanceof CsvError) {
      const line = typeof e.lines === 'number' ? e.lines : 0;
      throw new UploadRejected(422, `The file is not valid CSV near line ${line}: ${e.message}`, [{ row: line, column: null, message: e.message }]);
    }
    throw e;
  }
  if (!header) throw new UploadRejected(422, 'The file is empty; it needs a header row and at least one data row');
  if (rows === 0) throw new UploadRejected(422, 'The file has a header but no data rows', [{ row: 2, column: null, message: 'No data rows after the header' }]);
  if (rows > UPLOAD_MAX_ROWS) {
    throw new UploadRejected(413, `The file has ${rows.toLocaleString('en')} data rows; the limit is ${UPLOAD_MAX_ROWS.toLocaleString('en')} per upload. Split it into smaller files`);
  }
  return { header, rows };
}
