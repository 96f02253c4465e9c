import { beforeAll, describe, expect, it } from 'vitest';
import express from 'express';
import { testAppWithMail } from './../setup/mail';
import { anonymousClient, signedInClient, type Client } from '../setup/auth';
import { ACTORS, ALLOWED, MATRIX, type Actor, type Entry, type Expected } from './authorization-matrix/index';
import { buildWorld, type Built } from './authorization-matrix/world';
import { mountedRoutes } from './authorization-matrix/mounted-routes';

// Every API route × every caller: the status each must get, and that no response ever carries
// another clinic's rows (or, for researchers and signed-out callers, any name or identifier).
const ctx = testAppWithMail();
let built: Built;
const clients = new Map<Actor, Client>();

const clientFor = async (actor: Actor) =>
  actor === 'anon' ? anonymousClient(ctx.app) : signedInClient(ctx.app, built.emails[actor]);

beforeAll(async () => {
  built = await buildWorld(ctx.db, ctx.app);
  for (const a of ACTORS) clients.set(a, await clientFor(a));
}, 120_000);

const isAllowed = (e: Expected) => e === ALLOWED || (Array.isArray(e) ? e : [e]).some((s) => s !== 401 && s !== 403);

function expectedFor(entry: Entry, actor: Actor): Expected {
  const given = entry.expect[actor];
  if (given !== undefined) return given;
  if (actor === 'otherLead' || actor === 'otherClinician') {
    const same = expectedFor(entry, actor === 'otherLead' ? 'lead' : 'clinician');
    return entry.otherClinic === 'not-found' && isAllowed(same) ? 404 : same;
  }
  return actor === 'anon' ? 401 : 403;
}

function matches(status: number, e: Expected): boolean {
  if (e === ALLOWED) return status < 500 && status !== 401 && status !== 403;
  return (Array.isArray(e) ? e : [e]).includes(status);
}

/** What a caller must never see. */
function forbiddenFor(actor: Actor): RegExp[] {
  const m = built.markers;
  if (actor === 'lead' || actor === 'clinician') return m.clinicB;
  if (actor === 'otherLead' || actor === 'otherClinician') return m.clinicA;
  if (actor === 'researcher') return m.identifying;
  if (actor === 'anon') return [...m.clinicA, ...m.clinicB];
  return [];
}

async function call(client: Client, entry: Entry, actor: Actor) {
  const url = entry.url ? entry.url(built.world, actor) : entry.route;
  const method = entry.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  const req = method === 'get' ? client.get(url) : client[method](url);
  return entry.body ? req.send(entry.body(built.world, actor) as object) : req;
}

const key = (e: Entry) => `${e.method} ${e.route}`;

describe('authorisation matrix', () => {
  it('lists every mounted API route, and only mounted ones', () => {
    const mounted = mountedRoutes(ctx.app).filter((r) => r.split(' ')[1]!.startsWith('/api/'));
    const listed = new Set(MATRIX.map(key));
    expect(
      mounted.filter((r) => !listed.has(r)),
      'mounted routes missing from the matrix',
    ).toEqual([]);
    expect(
      [...listed].filter((r) => !mounted.includes(r)),
      'matrix entries for routes that are not mounted',
    ).toEqual([]);
    expect(mounted.length).toBeGreaterThan(20);
  });

  it('reads routes of nested routers, with and without a mount path', () => {
    const inner = express.Router();
    inner.get('/:id', () => undefined);
    inner
      .route('/:id/things')
      .post(() => undefined)
      .delete(() => undefined);
    const api = express.Router();
    api.use('/nested', inner);
    api.use(express.Router().patch('/flat', () => undefined));
    const app = express();
    app.use('/api', api);
    expect(mountedRoutes(app)).toEqual([
      'DELETE /api/nested/:id/things',
      'GET /api/nested/:id',
      'PATCH /api/flat',
      'POST /api/nested/:id/things',
    ]);
  });

  it('the leak markers do find rows where a caller may see them (so their absence elsewhere means something)', async () => {
    const { clinicA, clinicB } = built.world;
    const steward = await clients.get('steward')!.get(`/api/episodes?clinicId=${clinicB.id}&limit=200`);
    expect(built.markers.clinicB.some((m) => m.test(steward.text))).toBe(true);
    const lead = await clients.get('lead')!.get('/api/episodes?limit=200');
    expect(built.markers.clinicA.some((m) => m.test(lead.text))).toBe(true);
    expect(built.markers.clinicB.some((m) => m.test(lead.text))).toBe(false);
    const csv = await clients.get('researcher')!.get(`/api/data-requests/${built.world.dataRequestId}/export.csv`);
    expect(csv.status).toBe(200);
    expect(csv.text.split('\n').length).toBeGreaterThan(5);
    expect(clinicA.id).not.toBe(clinicB.id);
  });

  it.each(MATRIX.map((e) => [`${key(e)}${e.variant ? ` (${e.variant})` : ''}`, e] as const))(
    '%s',
    async (_name, entry) => {
      const problems: string[] = [];
      for (const actor of ACTORS) {
        const client = entry.endsSession ? await clientFor(actor) : clients.get(actor)!;
        const res = await call(client, entry, actor);
        // a response that hands out a new CSRF cookie (GET /api/auth/csrf) makes the client's header token stale
        const cookies = (res.headers['set-cookie'] as unknown as string[] | undefined) ?? [];
        if (cookies.some((c) => c.startsWith('loadline.csrf='))) await client.refreshCsrf();
        const want = expectedFor(entry, actor);
        if (!matches(res.status, want)) {
          problems.push(`${actor}: got ${res.status}, expected ${JSON.stringify(want)} — ${res.text.slice(0, 160)}`);
        }
        const text = res.text ?? '';
        for (const m of forbiddenFor(actor)) if (m.test(text)) problems.push(`${actor}: response contains ${m.source}`);
      }
      expect(problems).toEqual([]);
    },
  );
});
