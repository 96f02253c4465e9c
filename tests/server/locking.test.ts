import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { and, eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEvents, episodes } from '../../server/db/schema';
import type { EpisodeDetail } from '../../shared/schemas/episode';
import { createUser, TEST_PASSWORD } from '../setup/auth';
import { testApp, type TestContext } from '../setup/test-app';
import { HttpClient } from '../stress/http-client';
import { createClinic, episodeInput } from './episodes-fixtures';

// Optimistic locking under contention, over real HTTP on a listening server: many clinicians of one clinic send
// changes of the same episode at the same moment, each with the version they last saw.
let ctx: TestContext;
let server: Server;
let clients: HttpClient[];
let episodeId: number;

beforeAll(async () => {
  ctx = testApp();
  const clinic = await createClinic(ctx.db, 'LOCK');
  server = await new Promise<Server>((resolve) => {
    const s = ctx.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  clients = [];
  for (let i = 0; i < 20; i++) {
    const user = await createUser(ctx.db, 'clinician', clinic.id);
    const c = new HttpClient(base);
    await c.signIn(user.email, TEST_PASSWORD);
    clients.push(c);
  }
  const created = await clients[0]!.post('/api/episodes', episodeInput({ symptomWeeks: 0 }));
  expect(created.status).toBe(201);
  episodeId = created.json<EpisodeDetail>().id;
}, 60_000);

afterAll(async () => {
  for (const c of clients ?? []) c.close();
  await new Promise((r) => (server ? server.close(r) : r(undefined)));
  await ctx?.close();
});

const stored = async () => (await ctx.db.select().from(episodes).where(eq(episodes.id, episodeId)))[0]!;
const updates = async () =>
  (
    await ctx.db
      .select({ detail: auditEvents.detail })
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'episode'), eq(auditEvents.entityId, String(episodeId)), eq(auditEvents.action, 'update')))
      .orderBy(auditEvents.id)
  ).map((a) => a.detail as { fromVersion: number; toVersion: number });

describe('optimistic locking under contention', () => {
  it('20 concurrent changes with the same version: exactly one wins per version, the other 19 get 409', async () => {
    for (let round = 0; round < 4; round++) {
      const { version } = await stored();
      const answers = await Promise.all(
        clients.map((c, i) => c.patch(`/api/episodes/${episodeId}`, { version, symptomWeeks: 100 * (round + 1) + i })),
      );
      const won = answers.filter((a) => a.status === 200);
      const lost = answers.filter((a) => a.status === 409);
      expect(won).toHaveLength(1);
      expect(lost).toHaveLength(19);
      for (const a of lost) expect(a.json<{ error: { message: string } }>().error.message).toMatch(/changed by someone else/);
      const winner = won[0]!.json<EpisodeDetail>();
      expect(winner.version).toBe(version + 1);
      // The stored row is the winner's change, not a mix and not a loser's.
      const row = await stored();
      expect({ version: row.version, symptomWeeks: row.symptomWeeks }).toEqual({ version: version + 1, symptomWeeks: winner.symptomWeeks });
    }
    const trail = await updates();
    expect(trail.map((d) => d.toVersion - d.fromVersion)).toEqual([1, 1, 1, 1]);
    expect(new Set(trail.map((d) => d.fromVersion)).size).toBe(4); // one audited change per version
  });

  it('no lost update: 10 clients each add 1 to a field five times, re-reading after every 409', async () => {
    const start = await stored();
    const updatesBefore = (await updates()).length;
    let conflicts = 0;
    const incrementFive = async (c: HttpClient) => {
      for (let done = 0; done < 5; ) {
        const e = (await c.get(`/api/episodes/${episodeId}`)).json<EpisodeDetail>();
        const a = await c.patch(`/api/episodes/${episodeId}`, { version: e.version, symptomWeeks: e.symptomWeeks + 1 });
        if (a.status === 200) done++;
        else if (a.status === 409) conflicts++;
        else throw new Error(`unexpected ${a.status}: ${a.body.toString()}`);
      }
    };
    await Promise.all(clients.slice(0, 10).map(incrementFive));
    const end = await stored();
    expect(end.symptomWeeks).toBe(start.symptomWeeks + 50);
    expect(end.version).toBe(start.version + 50);
    expect((await updates()).length).toBe(updatesBefore + 50);
    expect(conflicts).toBeGreaterThan(0); // the clients really did collide
    const [{ n }] = (await ctx.db.execute<{ n: number }>(sql`select count(*)::int as n from episode where id = ${episodeId}`)).rows as [{ n: number }];
    expect(n).toBe(1);
  });
});
