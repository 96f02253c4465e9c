import { stringify } from 'csv-stringify/sync';
import { UPLOAD_COLUMNS } from '../../shared/upload-columns';

/** The template: the header and two example rows (a baseline and a follow-up of one invented episode). */
export function uploadTemplateCsv(): string {
  return stringify([UPLOAD_COLUMNS.map((c) => c.name), UPLOAD_COLUMNS.map((c) => c.example[0]), UPLOAD_COLUMNS.map((c) => c.example[1])]);
}
