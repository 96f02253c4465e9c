import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { openDatabase, type Database } from '../../server/db/client';
import { consistencyProblems } from '../setup/consistency';
import { startChildServer, type ChildServer } from './child-server';
import { describeLoad, runLoad } from './load-run';

/**
 * The load test: 50 signed-in clinicians for `seconds` against the app in its own process, on loopback.
 * Speed is reported, not asserted; what is asserted is no 5xx and every acknowledged write stored exactly once.
 */
export function loadSuite(opts: { seconds: number; seed: number; minRequests?: number }): void {
  let server: ChildServer;
  let database: Database;
  beforeAll(async () => {
    database = openDatabase(inject('databaseUrl'), 4);
    server = await startChildServer(inject('databaseUrl'));
  });
  afterAll(async () => {
    await server?.stop();
    await database?.pool.end();
  });

  describe(`load: 50 concurrent clients for ${opts.seconds} s`, () => {
    it('answers every request without a 5xx, and every acknowledged write is stored exactly once', async () => {
      const report = await runLoad({
        url: server.url,
        db: database.db,
        clients: 50,
        seconds: opts.seconds,
        clinics: 5,
        seed: opts.seed,
      });
      console.log(describeLoad(report, `load (50 clients, ${opts.seconds} s)`));
      expect(report.status5xx, server.output().slice(-2000)).toBe(0);
      expect(report.unexpected.slice(0, 10)).toEqual([]);
      if (opts.minRequests !== undefined) expect(report.requests).toBeGreaterThan(opts.minRequests);
      expect(report.ledger.uploadIds.length).toBeGreaterThan(0);
      expect(await report.ledger.problems(database.db, report.clinicIds)).toEqual([]);
      expect(await consistencyProblems(database.db)).toEqual([]);
    });
  });
}
