import type { InterventionInput } from '../../shared/schemas/episode';
import type { ReferenceData } from './reference.service';

/** A problem with one field; `field` is the instrument code for scores, the list index for interventions. */
export type FieldProblem = { field: string; message: string };

const fmt = (n: number) => (n < 0 ? `−${-n}` : String(n));

/** Scores against the instrument rows: known, not retired, inside the instrument's range. */
export function scoreProblems(scores: Record<string, number>, ref: ReferenceData): FieldProblem[] {
  const out: FieldProblem[] = [];
  for (const [code, value] of Object.entries(scores)) {
    const ins = ref.instruments.get(code);
    if (!ins) out.push({ field: code, message: `Unknown instrument “${code}”` });
    else if (ins.retired) out.push({ field: code, message: `${ins.label} (${code}) is retired; record no new scores on it` });
    else if (value < ins.min || value > ins.max) {
      out.push({
        field: code,
        message: `${ins.label} (${code}) runs from ${fmt(ins.min)} to ${fmt(ins.max)}; ${fmt(value)} is outside that range`,
      });
    }
  }
  return out;
}

export type ResolvedIntervention = { codeId: number; code: string; startWeek: number; maxLevel: number | null };

/** Intervention codes: accepted, each once, and a level (1–3) only on graded codes. */
export function resolveInterventions(
  list: readonly InterventionInput[],
  ref: ReferenceData,
): { resolved: ResolvedIntervention[]; problems: FieldProblem[] } {
  const resolved: ResolvedIntervention[] = [];
  const problems: FieldProblem[] = [];
  const seen = new Set<string>();
  list.forEach((item, i) => {
    const code = ref.interventions.get(item.code);
    const field = String(i);
    if (!code) problems.push({ field, message: `Unknown intervention code “${item.code}”` });
    else if (seen.has(item.code)) problems.push({ field, message: `“${item.code}” is listed twice` });
    else if (item.maxLevel != null && !code.graded) {
      problems.push({ field, message: `“${item.code}” (${code.label}) has no levels; leave the level empty` });
    } else {
      resolved.push({ codeId: code.id, code: item.code, startWeek: item.startWeek ?? 0, maxLevel: item.maxLevel ?? null });
    }
    seen.add(item.code);
  });
  return { resolved, problems };
}
