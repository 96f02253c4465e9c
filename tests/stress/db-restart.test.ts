import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { openDatabase, type Database } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { createDatabase } from '../../scripts/db';
import { createClinic, createUser, TEST_PASSWORD } from '../setup/auth';
import { HttpClient } from './http-client';
import { startPrivateCluster, type PrivateCluster } from './private-cluster';

// The database goes away under a running server and comes back: the server answers 503 with a clear message
// meanwhile and serves again afterwards, without being restarted. The cluster is a private one of this test.
let cluster: PrivateCluster;
let database: Database;
let server: Server;
let client: HttpClient;
const logs: string[] = [];

const episode = (reference: string) => ({
  pseudonym: 'ab'.repeat(32),
  reference,
  side: 'right',
  startDate: '2025-09-01',
  symptomWeeks: 8,
  ageYears: 39,
  sex: 'male',
  heightCm: 181,
  weightKg: 84,
  activityProfile: 'runner',
  standingWork: false,
  researchConsent: true,
  baseline: { assessedOn: '2025-09-01', scores: { 'nprs-first-step': 6 } },
});

beforeAll(async () => {
  cluster = await startPrivateCluster();
  database = openDatabase(await createDatabase(cluster, 'loadline', false), 4);
  await migrateDatabase(database.db);
  const clinic = await createClinic(database.db, 'Restart clinic');
  const user = await createUser(database.db, 'clinician', clinic.id);
  const app = createApp({ ...database, log: (m) => logs.push(m) });
  server = await new Promise<Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  client = new HttpClient(`http://127.0.0.1:${(server.address() as AddressInfo).port}`);
  await client.signIn(user.email, TEST_PASSWORD);
}, 120_000);

afterAll(async () => {
  client?.close();
  await new Promise((r) => (server ? server.close(r) : r(undefined)));
  await database?.pool.end();
  cluster?.destroy();
});

describe('database restart under a running server', () => {
  it('answers 503 with a clear message while the database is down, and serves the same session after it is back', async () => {
    expect((await client.post('/api/episodes', episode('RS-BEFORE'))).status).toBe(201);
    expect((await client.get('/api/episodes')).status).toBe(200);

    cluster.stop();
    const during = [
      await client.get('/api/health'),
      await client.get('/api/episodes'),
      await client.post('/api/episodes', episode('RS-DURING')),
    ];
    for (const a of during) {
      expect(a.status).toBe(503);
      expect(a.json<{ error: { message: string } }>().error.message).toBe('The registry database is unavailable; try again in a moment');
      expect(a.ms).toBeLessThan(10_000); // a prompt answer, not a hang until the client gives up
    }

    cluster.start();
    let health = await client.get('/api/health');
    for (let i = 0; i < 50 && health.status !== 200; i++) {
      await new Promise((r) => setTimeout(r, 200));
      health = await client.get('/api/health');
    }
    expect(health.status).toBe(200);
    // The same signed-in session (sessions live in the database) works again: read and write.
    expect((await client.post('/api/episodes', episode('RS-AFTER'))).status).toBe(201);
    const list = await client.get('/api/episodes?sort=reference&order=asc');
    expect(list.status).toBe(200);
    // What was acknowledged before the outage is there; what was refused during it is not.
    expect(list.json<{ items: { reference: string }[] }>().items.map((e) => e.reference)).toEqual(['RS-AFTER', 'RS-BEFORE']);
    expect(logs.filter((l) => l.startsWith('error 500'))).toEqual([]);
  });
});
