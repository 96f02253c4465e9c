import { and, eq, gt, inArray, isNull, sql } from 'drizzle-orm';
import { todayUtc } from '../../shared/follow-up-schedule';
import {
  SelfReportSubmitSchema,
  SelfReportTokenSchema,
  type SelfReportForm,
  type SelfReportQuestion,
} from '../../shared/schemas/follow-ups';
import type { Db } from '../db/client';
import { assessments, clinics, episodes, instruments, scores, selfReportLinks } from '../db/schema';
import { ConflictError, HttpError, NotFoundError, ValidationError } from '../errors';
import { audit } from './audit';
import { assertClinicAccepts } from './clinics.service';
import { assessmentDateProblem } from './episodes-rules';
import { hashSelfReportToken } from './self-report-links.service';

const UNKNOWN = 'This link does not work. Check that the whole link was copied, or ask your clinic for a new one.';
const USED = 'This link has already been used: each link takes one set of answers. Thank you for answering.';
const EXPIRED =
  'This link has expired. Links work for 14 days; ask your clinic for a new one if you still want to answer.';
const CLOSED = 'This clinic no longer takes answers through this link. Please contact your clinic.';

const gone = (message: string) => new HttpError(410, message);

/** Totals that are one whole-number rating get a row of buttons; sums are whole numbers, means and percentages take a decimal. */
const RATING = /^(nprs-.+|groc)$/;
const WHOLE_SUM = new Set(['lefs']);
/** Every follow-up asks for the global rating of change; pain questions come first (common practice). */
const ALWAYS_ASKED = ['groc'];
const FALLBACK = ['nprs-first-step', 'nprs-usual'];

type Link = {
  id: number;
  episodeId: number;
  timepoint: SelfReportForm['timepoint'];
  clinicId: number;
  clinicName: string;
};

/** The link behind a token: 404 for a malformed, tampered or unknown token; 410 once used or expired. */
async function findLink(db: Db, token: string): Promise<Link> {
  if (!SelfReportTokenSchema.safeParse(token).success) throw new NotFoundError(UNKNOWN);
  const [row] = await db
    .select({
      id: selfReportLinks.id,
      episodeId: selfReportLinks.episodeId,
      timepoint: selfReportLinks.timepoint,
      expiresAt: selfReportLinks.expiresAt,
      usedAt: selfReportLinks.usedAt,
      clinicId: episodes.clinicId,
      clinicName: clinics.displayName,
      clinicActive: clinics.active,
    })
    .from(selfReportLinks)
    .innerJoin(episodes, eq(episodes.id, selfReportLinks.episodeId))
    .innerJoin(clinics, eq(clinics.id, episodes.clinicId))
    .where(eq(selfReportLinks.tokenHash, hashSelfReportToken(token)));
  if (!row) throw new NotFoundError(UNKNOWN);
  if (row.usedAt) throw gone(USED);
  if (row.expiresAt.getTime() <= Date.now()) throw gone(EXPIRED);
  if (!row.clinicActive) throw gone(CLOSED);
  return {
    id: row.id,
    episodeId: row.episodeId,
    timepoint: row.timepoint,
    clinicId: row.clinicId,
    clinicName: row.clinicName,
  };
}

/** The instruments this episode is measured with (any of its assessments), plus the global rating of change. */
async function questionsFor(db: Db, episodeId: number): Promise<(SelfReportQuestion & { id: number })[]> {
  const used = await db
    .selectDistinct({ code: instruments.code })
    .from(scores)
    .innerJoin(assessments, eq(assessments.id, scores.assessmentId))
    .innerJoin(instruments, eq(instruments.id, scores.instrumentId))
    .where(eq(assessments.episodeId, episodeId));
  const codes = [...new Set([...(used.length > 0 ? used.map((u) => u.code) : FALLBACK), ...ALWAYS_ASKED])];
  const rows = await db
    .select({
      id: instruments.id,
      code: instruments.code,
      label: instruments.label,
      min: instruments.min,
      max: instruments.max,
    })
    .from(instruments)
    .where(and(inArray(instruments.code, codes), eq(instruments.retired, false)));
  const rank = (code: string) => (code.startsWith('nprs-') ? 0 : code === 'groc' ? 2 : 1);
  return rows
    .sort((a, b) => rank(a.code) - rank(b.code) || a.id - b.id)
    .map((r) => ({
      ...r,
      input: RATING.test(r.code) ? ('rating' as const) : ('number' as const),
      step: RATING.test(r.code) || WHOLE_SUM.has(r.code) ? 1 : 0.1,
    }));
}

/** GET /api/self-report/:token: only what the page shows. */
export async function readSelfReportForm(db: Db, token: string): Promise<SelfReportForm> {
  const link = await findLink(db, token);
  const questions = (await questionsFor(db, link.episodeId)).map(({ id: _id, ...q }) => q);
  return { clinicName: link.clinicName, timepoint: link.timepoint, questions };
}

const onStep = (v: number, q: SelfReportQuestion) =>
  Math.abs(Math.round((v - q.min) / q.step) * q.step + q.min - v) < 1e-9;

/**
 * POST /api/self-report/:token: stores one assessment reported by the patient and uses the link up, in one
 * transaction. Bad answers (422), an unknown token (404), or a used or expired link (410) write nothing.
 */
export async function submitSelfReport(db: Db, token: string, raw: unknown): Promise<{ assessmentId: number }> {
  const link = await findLink(db, token);
  const input = SelfReportSubmitSchema.parse(raw);
  const questions = await questionsFor(db, link.episodeId);
  const byCode = new Map(questions.map((q) => [q.code, q]));
  const issues = Object.entries(input.scores).flatMap(([code, value]) => {
    const q = byCode.get(code);
    if (!q) return [{ path: ['scores', code], message: 'This question is not part of this form' }];
    if (value < q.min || value > q.max)
      return [{ path: ['scores', code], message: `Give a number from ${q.min} to ${q.max}` }];
    if (!onStep(value, q))
      return [{ path: ['scores', code], message: q.step === 1 ? 'Give a whole number' : 'Use at most one decimal' }];
    return [];
  });
  if (issues.length > 0) throw new ValidationError('Some answers are not valid', issues);

  return db.transaction(async (tx) => {
    await assertClinicAccepts(tx, link.clinicId); // a deactivated clinic accepts nothing new
    // Lock the episode as the episode API does, so assessments of one episode are written one at a time.
    const [episode] = await tx
      .select({ startDate: episodes.startDate })
      .from(episodes)
      .where(eq(episodes.id, link.episodeId))
      .for('update');
    const [baseline] = await tx
      .select({ on: assessments.assessedOn })
      .from(assessments)
      .where(and(eq(assessments.episodeId, link.episodeId), eq(assessments.timepoint, 'baseline')));
    const problem = assessmentDateProblem(link.timepoint, todayUtc(), episode!.startDate, baseline?.on ?? null);
    if (problem)
      throw new ConflictError(
        'Your clinic has not finished setting up this record yet. Please try again later or contact them.',
      );
    // The conditional update is the single use: of two simultaneous submissions only one gets the row back.
    const [claimed] = await tx
      .update(selfReportLinks)
      .set({ usedAt: sql`now()` })
      .where(
        and(eq(selfReportLinks.id, link.id), isNull(selfReportLinks.usedAt), gt(selfReportLinks.expiresAt, sql`now()`)),
      )
      .returning({ id: selfReportLinks.id });
    if (!claimed) throw gone(USED);
    const [assessment] = await tx
      .insert(assessments)
      .values({
        episodeId: link.episodeId,
        assessedOn: todayUtc(),
        timepoint: link.timepoint,
        reporter: 'patient',
        avgDailySteps: input.avgDailySteps ?? null,
        createdBy: null,
      })
      .onConflictDoNothing()
      .returning({ id: assessments.id });
    if (!assessment)
      throw new ConflictError('Answers for this follow-up were already recorded today; your clinic has them.');
    await tx
      .insert(scores)
      .values(
        Object.entries(input.scores).map(([code, value]) => ({
          assessmentId: assessment.id,
          instrumentId: byCode.get(code)!.id,
          value,
        })),
      );
    await tx.update(selfReportLinks).set({ assessmentId: assessment.id }).where(eq(selfReportLinks.id, link.id));
    await audit(tx, {
      actorId: null,
      clinicId: link.clinicId,
      action: 'create',
      entity: 'assessment',
      entityId: assessment.id,
      detail: { via: 'self-report', episodeId: link.episodeId, timepoint: link.timepoint, linkId: link.id },
    });
    return { assessmentId: assessment.id };
  });
}
