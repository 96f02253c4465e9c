import { afterAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import express from 'express';
import { z } from 'zod';
import { errorHandler, ConflictError, ForbiddenError } from '../../server/errors';
import { testApp } from '../setup/test-app';

const ctx = testApp();
afterAll(() => ctx.close());

/** A tiny app with routes that throw each kind of error through the real error middleware. */
function throwingApp() {
  const logs: string[] = [];
  const app = express();
  app.use(express.json({ limit: '10b' }));
  app.post('/echo', (req, res) => {
    res.json(z.object({ n: z.number().int() }).parse(req.body));
  });
  app.get('/forbidden', () => {
    throw new ForbiddenError();
  });
  app.get('/conflict', () => {
    throw new ConflictError('Stale version');
  });
  app.get('/boom', () => {
    throw new Error('secret internal detail');
  });
  app.use(errorHandler((m) => logs.push(m)));
  return { app, logs };
}

describe('JSON error format', () => {
  it('unknown API route → 404 JSON', async () => {
    const res = await request(ctx.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { message: 'No such API route' } });
  });

  it('malformed JSON → 400', async () => {
    const res = await request(ctx.app).post('/api/health').set('content-type', 'application/json').send('{"a":');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/not valid JSON/);
  });

  it('failed validation → 422 with the zod issues', async () => {
    const { app } = throwingApp();
    const res = await request(app).post('/echo').send({ n: 1.5 });
    expect(res.status).toBe(422);
    expect(res.body.error.issues[0].path).toEqual(['n']);
  });

  it('too large → 413', async () => {
    const { app } = throwingApp();
    const res = await request(app).post('/echo').send({ n: 123456789012 });
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/too large/);
  });

  it('403 and 409 keep their status and message', async () => {
    const { app } = throwingApp();
    expect((await request(app).get('/forbidden')).status).toBe(403);
    const res = await request(app).get('/conflict');
    expect(res.status).toBe(409);
    expect(res.body).toEqual({ error: { message: 'Stale version' } });
  });

  it('500 hides the stack and message but logs them', async () => {
    const { app, logs } = throwingApp();
    const res = await request(app).get('/boom');
    expect(res.status).toBe(500);
    expect(JSON.stringify(res.body)).not.toMatch(/secret internal detail|at /);
    expect(logs.join('\n')).toMatch(/secret internal detail/);
  });
});
