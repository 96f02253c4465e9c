import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testApp } from '../setup/test-app';
import { createClinic, createUser, signedInClient, type Client } from '../setup/auth';
import { auditCountBy, unique } from './admin-fixtures';

const ctx = testApp();
afterAll(() => ctx.close());
let stewardId: number;
let steward: Client;
let leadId: number;
let lead: Client;
let otherLead: Client;

beforeAll(async () => {
  const s = await createUser(ctx.db, 'steward');
  stewardId = s.id;
  steward = await signedInClient(ctx.app, s.email);
  const a = await createClinic(ctx.db, 'Codes clinic A');
  const b = await createClinic(ctx.db, 'Codes clinic B');
  const l = await createUser(ctx.db, 'lead', a.id);
  leadId = l.id;
  lead = await signedInClient(ctx.app, l.email);
  otherLead = await signedInClient(ctx.app, (await createUser(ctx.db, 'lead', b.id)).email);
});

type Code = { id: number; code: string; status: string; graded: boolean; kind: string };

describe('intervention codes and clinic proposals', () => {
  it('lists the shipped core and add-on codes', async () => {
    const res = await steward.get('/api/admin/intervention-codes');
    expect(res.status).toBe(200);
    const kinds = new Set((res.body.items as Code[]).map((c) => c.kind));
    expect(kinds).toEqual(new Set(['core', 'addon']));
  });

  it('the steward adds a graded code and relabels it; each write is audited once', async () => {
    const before = await auditCountBy(ctx.db, stewardId, 'intervention-code');
    const code = `addon-${unique()}`;
    const res = await steward.post('/api/admin/intervention-codes').send({ code, label: 'Calf raises on a step', kind: 'addon', graded: true });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ code, status: 'accepted', graded: true, useCount: 0 });
    const edit = await steward.patch(`/api/admin/intervention-codes/${res.body.id}`).send({ label: 'Calf raises, single leg' });
    expect(edit.body.label).toBe('Calf raises, single leg');
    expect(await auditCountBy(ctx.db, stewardId, 'intervention-code')).toBe(before + 2);
    expect((await steward.post('/api/admin/intervention-codes').send({ code, label: 'Again', kind: 'addon' })).status).toBe(409);
    expect((await steward.post('/api/admin/intervention-codes').send({ code: 'Bad Code', label: 'x', kind: 'other' })).status).toBe(422);
  });

  it('a lead proposes a code; only the steward decides; the lead sees only their own proposals', async () => {
    const code = `own-${unique()}`;
    const prop = await lead.post('/api/intervention-codes/proposals').send({ code, label: 'Toe-yoga drills', graded: false });
    expect(prop.status).toBe(201);
    expect(prop.body).toMatchObject({ code, status: 'proposed', kind: 'addon' });
    expect(await auditCountBy(ctx.db, leadId, 'intervention-code')).toBe(1);
    const mine = await lead.get('/api/intervention-codes/proposals');
    expect(mine.body.items.map((c: Code) => c.code)).toEqual([code]);
    expect((await otherLead.get('/api/intervention-codes/proposals')).body.items.map((c: Code) => c.code)).not.toContain(code);
    expect((await lead.post(`/api/admin/intervention-codes/${prop.body.id}/decision`).send({ decision: 'accept' })).status).toBe(403);
    expect((await steward.post('/api/intervention-codes/proposals').send({ code: `s-${unique()}`, label: 'Steward tries' })).status).toBe(403);

    const before = await auditCountBy(ctx.db, stewardId, 'intervention-code');
    const ok = await steward.post(`/api/admin/intervention-codes/${prop.body.id}/decision`).send({ decision: 'accept', note: 'Useful for runners' });
    expect(ok.body.status).toBe('accepted');
    expect(await auditCountBy(ctx.db, stewardId, 'intervention-code')).toBe(before + 1);
    expect((await steward.post(`/api/admin/intervention-codes/${prop.body.id}/decision`).send({ decision: 'decline' })).status).toBe(409);

    const second = await lead.post('/api/intervention-codes/proposals').send({ code: `own-${unique()}`, label: 'Barefoot walking' });
    const no = await steward.post(`/api/admin/intervention-codes/${second.body.id}/decision`).send({ decision: 'decline' });
    expect(no.body.status).toBe('declined');
  });
});
