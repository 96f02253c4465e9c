import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { testApp } from '../setup/test-app';

const ctx = testApp();
afterAll(() => ctx.close());

describe('GET /api/health', () => {
  it('answers db "up" after a real query', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, db: 'up' });
  });

  it('answers 503 with the JSON error shape when the database is gone', async () => {
    const { openDatabase } = await import('../../server/db/client');
    const { createApp } = await import('../../server/app');
    const dead = openDatabase('postgres://app@127.0.0.1:1/none', 1);
    const res = await request(createApp({ ...dead, log: () => undefined })).get('/api/health');
    await dead.pool.end();
    expect(res.status).toBe(503);
    expect(res.body.error.message).toMatch(/database is unavailable/);
  });
});
