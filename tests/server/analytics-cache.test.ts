import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import {
  assessments,
  clinics,
  episodeInterventions,
  episodes,
  interventionCodes,
  registryRules,
  scores,
} from '../../server/db/schema';
import { LruCache, readDataVersion } from '../../server/services/cache';
import { OutcomesResponseSchema } from '../../shared/schemas/analytics';
import { DEFAULT_RULES } from '../../shared/rules';
import { summariseRecoveryCurve, type Obs } from '../../analysis/index';
import { testApp } from '../setup/test-app';
import { loadRegistry, recoveryOf } from './analytics-recompute';
import { signedInClient } from '../setup/auth';
import { seedAnalyticsFixture, type AnalyticsFixture } from './analytics-fixtures';

const ctx = testApp();
let fx: AnalyticsFixture;
afterAll(() => ctx.close());
beforeAll(async () => {
  fx = await seedAnalyticsFixture(ctx.db, { clinics: 2, perClinic: 30, seed: 3 });
});

describe('registry data version', () => {
  it('is bumped by a write to each table the analytics read, once per statement', async () => {
    const ep = fx.episodeIds[0]!;
    const [a] = await ctx.db.select().from(assessments).where(eq(assessments.episodeId, ep)).limit(1);
    const [code] = await ctx.db.select().from(interventionCodes).where(eq(interventionCodes.code, 'night-splint'));
    const writes: [string, () => Promise<unknown>][] = [
      ['episode', () => ctx.db.update(episodes).set({ symptomWeeks: 20 }).where(eq(episodes.id, ep))],
      ['assessment', () => ctx.db.update(assessments).set({ avgDailySteps: 6100 }).where(eq(assessments.id, a!.id))],
      ['score', () => ctx.db.update(scores).set({ value: 4 }).where(eq(scores.assessmentId, a!.id))],
      [
        'episode_intervention',
        () => ctx.db.insert(episodeInterventions).values({ episodeId: ep, interventionCodeId: code!.id }),
      ],
      [
        'registry_rules',
        () =>
          ctx.db.insert(registryRules).values({ rules: DEFAULT_RULES, reason: 'cache test: same rules, new version' }),
      ],
      ['clinic', () => ctx.db.update(clinics).set({ region: 'Elsewhere' }).where(eq(clinics.id, fx.clinicIds[1]!))],
      // One statement touching many rows is still one bump.
      [
        'episode (many rows)',
        () => ctx.db.update(episodes).set({ standingWork: true }).where(eq(episodes.clinicId, fx.clinicIds[0]!)),
      ],
    ];
    for (const [table, write] of writes) {
      const before = await readDataVersion(ctx.db);
      await write();
      expect(await readDataVersion(ctx.db), table).toBe(before + 1);
    }
    const before = await readDataVersion(ctx.db);
    await ctx.db.execute(sql`select count(*) from episode`);
    expect(await readDataVersion(ctx.db)).toBe(before);
  });
});

describe('analytics cache', () => {
  it('serves a repeated view from the cache and recomputes after any write', async () => {
    const client = await signedInClient(ctx.app, fx.users.lead);
    const first = await client.get('/api/analytics/outcomes?instrument=faam-adl');
    expect(first.headers['x-analytics-cache']).toBe('miss');
    const again = await client.get('/api/analytics/outcomes?instrument=faam-adl');
    expect(again.headers['x-analytics-cache']).toBe('hit');
    expect(again.body).toEqual(first.body);
    // The same filters in another order are the same view.
    const a = await client.get('/api/analytics/outcomes?groupBy=sex&instrument=lefs');
    const b = await client.get('/api/analytics/outcomes?instrument=lefs&groupBy=sex');
    expect([a.headers['x-analytics-cache'], b.headers['x-analytics-cache']]).toEqual(['miss', 'hit']);

    // A new episode in the clinic changes the count at once.
    const count = OutcomesResponseSchema.parse(again.body).tiles.episodes;
    await ctx.db.insert(episodes).values({
      clinicId: fx.clinicIds[0]!,
      pseudonym: 'f'.repeat(64),
      reference: `CACHE-${Date.now()}`,
      conditionCode: 'plantar-heel-pain',
      side: 'right',
      startDate: '2025-01-06',
      symptomWeeks: 10,
      ageYears: 40,
      sex: 'female',
      heightCm: 170,
      weightKg: 70,
      activityProfile: 'active',
      standingWork: false,
      researchConsent: true,
    });
    const after = await client.get('/api/analytics/outcomes?instrument=faam-adl');
    expect(after.headers['x-analytics-cache']).toBe('miss');
    expect(OutcomesResponseSchema.parse(after.body).tiles.episodes).toBe(count + 1);
  });

  it('recomputes under new registry rules and says which version it used', async () => {
    const client = await signedInClient(ctx.app, fx.users.lead);
    const before = OutcomesResponseSchema.parse((await client.get('/api/analytics/outcomes')).body);
    const stricter = { ...DEFAULT_RULES, recovery: { instrumentCode: 'nprs-first-step', threshold: 1 } };
    const [row] = await ctx.db
      .insert(registryRules)
      .values({ rules: stricter, reason: 'cache test: stricter recovery' })
      .returning();
    try {
      const after = OutcomesResponseSchema.parse((await client.get('/api/analytics/outcomes')).body);
      expect([after.rulesVersion, after.recoveryRule.threshold]).toEqual([row!.version, 1]);
      expect(after.rulesVersion).toBeGreaterThan(before.rulesVersion);
      const reg = await loadRegistry(ctx.db);
      const obs = reg.episodes
        .filter((e) => e.clinicId === fx.clinicIds[0])
        .map((e) => recoveryOf(reg, e))
        .filter((o): o is Obs => o !== null);
      const at = summariseRecoveryCurve(obs, { weeks: [12] }).atWeeks[0]!;
      expect(after.tiles.recovered.share?.estimate).toBeCloseTo(at.estimate!, 12);
      expect(after.tiles.recovered.share?.estimate).toBeLessThan(before.tiles.recovered.share!.estimate!);
    } finally {
      await ctx.db.insert(registryRules).values({ rules: DEFAULT_RULES, reason: 'cache test: back to the defaults' });
    }
  });

  it('keeps each viewer’s answer apart', async () => {
    const lead = await signedInClient(ctx.app, fx.users.lead);
    const other = await signedInClient(ctx.app, fx.users.otherLead);
    const mine = OutcomesResponseSchema.parse((await lead.get('/api/analytics/outcomes')).body);
    const theirs = OutcomesResponseSchema.parse((await other.get('/api/analytics/outcomes')).body);
    expect(mine.meta.subject.clinicId).toBe(fx.clinicIds[0]);
    expect(theirs.meta.subject.clinicId).toBe(fx.clinicIds[1]);
  });
});

describe('LruCache', () => {
  it('forgets the least recently used entry first', () => {
    const c = new LruCache<number>(2);
    c.set('a', 1);
    c.set('b', 2);
    expect(c.get('a')).toBe(1); // a is now the most recent
    c.set('c', 3);
    expect([c.get('a'), c.get('b'), c.get('c'), c.size]).toEqual([1, undefined, 3, 2]);
    expect(() => new LruCache(0)).toThrow(RangeError);
  });
});
