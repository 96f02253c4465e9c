import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { assessments, episodes, instruments, scores } from '../../server/db/schema';
import { consistencyProblems } from '../setup/consistency';
import { testApp } from '../setup/test-app';
import { createClinic, fakePseudonym } from './episodes-fixtures';

// The consistency check used after the load, crash and fuzz tests finds what it is meant to find.
const ctx = testApp();
afterAll(() => ctx.close());

describe('the consistency check', () => {
  it('names an episode without a baseline, a follow-up dated before its baseline and an out-of-range score', async () => {
    const clinic = await createClinic(ctx.db, 'CONS');
    expect(await consistencyProblems(ctx.db, [clinic.id])).toEqual([]);
    const row = {
      clinicId: clinic.id, pseudonym: fakePseudonym('cons'), side: 'left' as const, startDate: '2025-01-06', symptomWeeks: 4, ageYears: 30,
      sex: 'male' as const, heightCm: 180, weightKg: 80, activityProfile: 'active' as const, standingWork: false, researchConsent: true, conditionCode: 'plantar-heel-pain',
    };
    // Written straight into the tables, past the services that would refuse them.
    const [bare] = await ctx.db.insert(episodes).values({ ...row, reference: 'CONS-BARE' }).returning();
    const [odd] = await ctx.db.insert(episodes).values({ ...row, reference: 'CONS-ODD' }).returning();
    await ctx.db.insert(assessments).values({ episodeId: odd!.id, assessedOn: '2025-03-03', timepoint: 'baseline', reporter: 'clinician' });
    const [early] = await ctx.db.insert(assessments).values({ episodeId: odd!.id, assessedOn: '2025-02-03', timepoint: 'week6', reporter: 'clinician' }).returning();
    const [pain] = await ctx.db.select().from(instruments).where(eq(instruments.code, 'nprs-first-step'));
    await ctx.db.insert(scores).values({ assessmentId: early!.id, instrumentId: pain!.id, value: 11 });
    expect(await consistencyProblems(ctx.db, [clinic.id])).toEqual([
      `episode without exactly one baseline: ${bare!.id}`,
      `score outside its instrument’s range: ${early!.id}`,
      `follow-up dated before its baseline: ${early!.id}`,
    ]);
    await ctx.db.delete(episodes).where(eq(episodes.clinicId, clinic.id)); // leave the shared database consistent
    expect(await consistencyProblems(ctx.db, [clinic.id])).toEqual([]);
  });
});
