import { afterAll, describe, expect, it } from 'vitest';
import pg from 'pg';
import { inject } from 'vitest';
import { readDataVersion } from '../../server/services/cache';
import { testApp } from '../setup/test-app';

const ctx = testApp();
afterAll(() => ctx.close());

describe('registry data version', () => {
  it('an open write transaction does not block another writer, and each commit raises the version', async () => {
    const a = new pg.Client({ connectionString: inject('databaseUrl') });
    const b = new pg.Client({ connectionString: inject('databaseUrl') });
    await a.connect();
    await b.connect();
    try {
      const tag = `DV${Date.now() % 1_000_000}`;
      const before = await readDataVersion(ctx.db);
      await a.query('begin');
      await a.query(`insert into clinic (code, display_name, region) values ($1, 'Open transaction', 'Test')`, [`${tag}A`]);
      // B must not wait for A's commit (a shared counter row would make it wait until the timeout).
      await b.query(`set statement_timeout = '2s'`);
      await b.query(`insert into clinic (code, display_name, region) values ($1, 'Other writer', 'Test')`, [`${tag}B`]);
      const afterB = await readDataVersion(ctx.db);
      expect(afterB).toBeGreaterThan(before);
      await a.query('commit');
      // A committed after B with an older row id: the version still moves on.
      expect(await readDataVersion(ctx.db)).toBeGreaterThan(afterB);
    } finally {
      await a.end();
      await b.end();
    }
  });
});
