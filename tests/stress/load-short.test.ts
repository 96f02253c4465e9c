import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { openDatabase, type Database } from '../../server/db/client';
import { consistencyProblems } from '../setup/consistency';
import { startChildServer, type ChildServer } from './child-server';
import { describeLoad, runLoad } from './load-run';

// The short load run of `npm test`: 50 signed-in clinicians for 10 s against the app in its own process.
// The 30-second run is tests/stress/load.stress.ts (`npm run test:stress`). Speed is reported, not asserted.
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

describe('load: 50 concurrent clients for 10 s', () => {
  it('answers every request without a 5xx, and every acknowledged write is stored exactly once', async () => {
    const report = await runLoad({ url: server.url, db: database.db, clients: 50, seconds: 10, clinics: 5, seed: 1 });
    console.log(describeLoad(report, 'load (50 clients, 10 s)'));
    expect(report.status5xx, server.output().slice(-2000)).toBe(0);
    expect(report.unexpected.slice(0, 10)).toEqual([]);
    expect(report.requests).toBeGreaterThan(200);
    expect(report.ledger.uploadIds.length).toBeGreaterThan(0);
    expect(await report.ledger.problems(database.db, report.clinicIds)).toEqual([]);
    expect(await consistencyProblems(database.db)).toEqual([]);
  });
});
