import { stringify } from 'csv-stringify/sync';
import type { AuditEvent, AuditQuery } from '../../../shared/schemas/admin';
import type { Db } from '../../db/client';
import type { Scope } from '../../db/scope';
import { ValidationError } from '../../errors';
import { audit } from '../audit';
import { AUDIT_CSV_MAX_ROWS, auditRowsForCsv } from './audit-query';

/**
 * A cell a spreadsheet would run as a formula (=, +, -, @, tab, carriage return first) gets a leading
 * apostrophe, so it shows as text (OWASP "CSV injection" guidance).
 */
export function neutraliseCell(value: unknown): string {
  const s = value == null ? '' : typeof value === 'string' ? value : typeof value === 'object' ? JSON.stringify(value) : String(value);
  return /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
}

const HEADER = ['id', 'when', 'actor', 'actor_email', 'clinic', 'action', 'entity', 'entity_id', 'detail'];

function toRow(e: AuditEvent): string[] {
  return [e.id, e.at, e.actorName, e.actorEmail, e.clinicCode, e.action, e.entity, e.entityId, e.detail].map(neutraliseCell);
}

/** The CSV of a filtered view of the trail; the download itself is an audited export. */
export async function auditCsv(db: Db, scope: Scope, q: Omit<AuditQuery, 'limit' | 'offset'>): Promise<{ csv: string; rows: number }> {
  const events = await auditRowsForCsv(db, scope, q);
  if (events.length > AUDIT_CSV_MAX_ROWS) {
    throw new ValidationError(`The view holds more than ${AUDIT_CSV_MAX_ROWS} events; narrow the filter (for example the dates) and download again`);
  }
  const csv = stringify([HEADER, ...events.map(toRow)]);
  await audit(db, {
    actorId: scope.userId,
    clinicId: scope.kind === 'clinic' ? scope.clinicId : null,
    action: 'export',
    entity: 'audit-trail',
    detail: { rows: events.length, filter: { ...q } },
  });
  return { csv, rows: events.length };
}
