import type { FieldError, FieldValues, Path, UseFormSetError } from 'react-hook-form';
import type { InstrumentInfo } from '../../../shared/schemas/reference';
import { ApiError } from '../../lib/api-client';

/** Score inputs as the form holds them: a blank input is `undefined`. */
export type ScoreInputs = Record<string, number | undefined>;

/** Turns an input's text into a number, a blank into `undefined` (so "not measured" is not 0). */
export const numberOrBlank = (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v));

/** Drops blank scores: only what was measured is sent. */
export function measuredScores(scores: ScoreInputs | undefined): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [code, v] of Object.entries(scores ?? {})) if (v !== undefined) out[code] = v;
  return out;
}

/** The message for a score outside its instrument's range; it names the range. */
export const rangeMessage = (i: InstrumentInfo) =>
  `${i.label} runs from ${i.min} to ${i.max}; enter a score in that range`;

/** Scores outside their instrument's range (the shared schema cannot know the ranges; the server checks too). */
export function scoreRangeErrors(
  scores: Record<string, number>,
  instruments: InstrumentInfo[],
): Record<string, FieldError> {
  const errors: Record<string, FieldError> = {};
  for (const i of instruments) {
    const v = scores[i.code];
    if (v === undefined || Number.isNaN(v)) continue;
    if (v < i.min || v > i.max) errors[i.code] = { type: 'range', message: rangeMessage(i) };
  }
  return errors;
}

type RawIssue = { code: string; input?: unknown; expected?: string; minimum?: unknown; maximum?: unknown };

/** Plain words for zod's generic messages; messages written in the shared schemas win over this. */
export function friendlyIssue(iss: RawIssue): string | undefined {
  if (iss.code === 'invalid_type') {
    if (iss.input === undefined || iss.input === '') return 'Fill in this field';
    if (typeof iss.input === 'number' && Number.isNaN(iss.input)) return 'Enter a number';
    if (iss.expected === 'int') return 'Enter a whole number';
    return 'Choose one of the options';
  }
  if (iss.code === 'invalid_value') return 'Choose one of the options';
  if (iss.code === 'too_small' && typeof iss.minimum !== 'undefined') return `Enter at least ${String(iss.minimum)}`;
  if (iss.code === 'too_big' && typeof iss.maximum !== 'undefined') return `Enter at most ${String(iss.maximum)}`;
  return undefined;
}

/**
 * Puts a 422's field issues next to their fields (paths as in the shared schema, prefixed when the
 * form nests them). Returns true when at least one issue found a field; otherwise the caller shows the message.
 */
export function applyServerIssues<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  prefix = '',
): boolean {
  if (!(error instanceof ApiError) || error.status !== 422 || !Array.isArray(error.issues)) return false;
  let placed = false;
  for (const raw of error.issues) {
    const issue = raw as { path?: unknown[]; message?: string };
    if (!Array.isArray(issue.path) || issue.path.length === 0 || !issue.message) continue;
    setError(`${prefix}${issue.path.join('.')}` as Path<T>, { type: 'server', message: issue.message });
    placed = true;
  }
  return placed;
}
