import type { FactsRow } from '../cohorts/derive';

/*
 * One row of the export's facts query (export-scan.ts) as the cohort engine's facts row: column 0 is the number
 * text "id clinic_id start_date age height weight symptom_weeks standing_work consent discharge_day
 * [intervention ids…]" (discharge_day empty when there is none), then condition, sex, activity profile, side,
 * status and discharge reason (empty when there is none), each after a unit separator (U+001F); column 1 is
 * the score text.
 */
const SEP = '\u001f';
const FIELDS = 7;

/**
 * Reads the number text of one row left to right. Integers are read digit by digit, as the cohort engine reads
 * its score text (split() and Number() on every field took three times as long); the date and the two numerics
 * are cut out and read with Number(), as the driver would.
 */
class NumberText {
  private pos = 0;
  constructor(private readonly text: string) {}
  get done(): boolean {
    return this.pos >= this.text.length;
  }
  /** An integer (int4, a day count), or null for an empty field. */
  int(): number | null {
    const t = this.text;
    let c = t.charCodeAt(this.pos);
    if (c === 32 || Number.isNaN(c)) {
      this.pos++;
      return null;
    }
    const sign = c === 45 ? -1 : 1;
    if (sign < 0) c = t.charCodeAt(++this.pos);
    let v = 0;
    while (c >= 48 && c <= 57) {
      v = v * 10 + (c - 48);
      c = t.charCodeAt(++this.pos);
    }
    if (!Number.isNaN(c) && c !== 32) throw new Error(`export: unexpected character in row text at ${this.pos}`);
    this.pos++;
    return sign * v;
  }
  word(): string {
    const end = this.text.indexOf(' ', this.pos);
    const w = this.text.slice(this.pos, end < 0 ? undefined : end);
    this.pos = end < 0 ? this.text.length : end + 1;
    return w;
  }
}

/** One row of `exportFactsQuery` as the cohort engine's facts row. */
export function decodeRow(r: readonly (string | null)[], regionOf: ReadonlyMap<number, string>): FactsRow {
  const t = r[0]!.split(SEP);
  // Codes and enum values never hold the separator; a row that does is refused rather than read shifted.
  if (t.length !== FIELDS) throw new Error(`export: a row has ${t.length} fields instead of ${FIELDS}`);
  const n = new NumberText(t[0]!);
  const id = n.int()!;
  const clinicId = n.int()!;
  const region = regionOf.get(clinicId);
  if (region === undefined) throw new Error(`export: episode of unknown clinic ${clinicId}`);
  const startDate = n.word();
  const age = n.int()!;
  const height = Number(n.word());
  const weight = Number(n.word());
  const weeks = n.int()!;
  const standing = n.int() === 1;
  const consent = n.int() === 1;
  const dischargeDay = n.int();
  let interventions: number[] | null = null;
  while (!n.done) (interventions ??= []).push(n.int()!);
  return {
    id,
    clinic_id: clinicId,
    region,
    condition_code: t[1]!,
    start_date: startDate,
    age_years: age,
    sex: t[2]!,
    height_cm: height,
    weight_kg: weight,
    activity_profile: t[3]!,
    standing_work: standing,
    side: t[4]!,
    symptom_weeks: weeks,
    research_consent: consent,
    status: t[5]!,
    discharge_reason: t[6] || null,
    discharge_day: dischargeDay,
    scores: r[1] ?? null,
    interventions,
  };
}
