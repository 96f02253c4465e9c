import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { users } from '../../server/db/schema';
import { testAppWithMail } from '../setup/mail';
import { createClinic, createUser, signedInClient, type Client } from '../setup/auth';
import { auditCountBy, unique } from './admin-fixtures';

const ctx = testAppWithMail();
let stewardId: number;
let steward: Client;
let clinicA: number;
let clinicB: number;
let lead: Client;
let leadId: number;

beforeAll(async () => {
  const s = await createUser(ctx.db, 'steward');
  stewardId = s.id;
  steward = await signedInClient(ctx.app, s.email);
  clinicA = (await createClinic(ctx.db, 'People clinic A')).id;
  clinicB = (await createClinic(ctx.db, 'People clinic B')).id;
  const l = await createUser(ctx.db, 'lead', clinicA);
  leadId = l.id;
  lead = await signedInClient(ctx.app, l.email);
});

type P = { id: number; role: string; clinicId: number | null; clinicCode: string | null; status: string };

describe('people in the console', () => {
  it('the steward lists everyone with filters and paging; the status tells invited from active', async () => {
    const c = await createUser(ctx.db, 'clinician', clinicB);
    const invite = await steward.post('/api/invitations').send({ email: `lead-${unique()}@test.loadline.test`, role: 'lead', clinicId: clinicB });
    expect(invite.status).toBe(201);
    const res = await steward.get(`/api/admin/people?clinicId=${clinicB}`);
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(2);
    const byId = new Map((res.body.items as P[]).map((p) => [p.id, p]));
    expect(byId.get(c.id)).toMatchObject({ role: 'clinician', status: 'active', clinicId: clinicB });
    expect(byId.get(invite.body.account.id)).toMatchObject({ role: 'lead', status: 'invited' });
    const invited = await steward.get(`/api/admin/people?clinicId=${clinicB}&status=invited`);
    expect(invited.body.items.map((p: P) => p.id)).toEqual([invite.body.account.id]);
    const page = await steward.get(`/api/admin/people?clinicId=${clinicB}&limit=1&offset=1`);
    expect(page.body).toMatchObject({ total: 2 });
    expect(page.body.items).toHaveLength(1);
    expect((await steward.get('/api/admin/people?limit=0')).status).toBe(422);
  });

  it('a lead sees only the clinicians of their own clinic', async () => {
    const mine = await createUser(ctx.db, 'clinician', clinicA);
    const other = await createUser(ctx.db, 'clinician', clinicB);
    const res = await lead.get('/api/admin/people');
    expect(res.status).toBe(200);
    const ids = (res.body.items as P[]).map((p) => p.id);
    expect(ids).toContain(mine.id);
    expect(ids).not.toContain(other.id);
    expect(ids).not.toContain(leadId);
    expect((res.body.items as P[]).every((p) => p.role === 'clinician' && p.clinicId === clinicA)).toBe(true);
    // Asking for the other clinic explicitly still answers only within the lead's scope.
    expect((await lead.get(`/api/admin/people?clinicId=${clinicB}`)).body.total).toBe(0);
  });

  it('a lead invites, resends and deactivates only clinicians of their clinic (through the invitation service)', async () => {
    const email = `clin-${unique()}@test.loadline.test`;
    const inv = await lead.post('/api/invitations').send({ email, role: 'clinician' });
    expect(inv.status).toBe(201);
    expect(inv.body.account).toMatchObject({ clinicId: clinicA, state: 'invited' });
    expect((await lead.post(`/api/invitations/${inv.body.account.id}/resend`)).status).toBe(200);
    expect(ctx.mail.lastTo(email).subject).toMatch(/Loadline/);
    expect((await lead.post('/api/invitations').send({ email: `x-${unique()}@test.loadline.test`, role: 'clinician', clinicId: clinicB })).status).toBe(403);
    expect((await lead.post('/api/invitations').send({ email: `y-${unique()}@test.loadline.test`, role: 'lead' })).status).toBe(403);
    const other = await createUser(ctx.db, 'clinician', clinicB);
    expect((await lead.post(`/api/users/${other.id}/deactivate`)).status).toBe(404);
    const mine = await createUser(ctx.db, 'clinician', clinicA);
    const d = await lead.post(`/api/users/${mine.id}/deactivate`);
    expect(d.status).toBe(200);
    const listed = await lead.get('/api/admin/people?status=deactivated');
    expect(listed.body.items.map((p: P) => p.id)).toContain(mine.id);
  });

  it('the steward changes a role and moves a person between clinics; each write is audited once', async () => {
    const p = await createUser(ctx.db, 'clinician', clinicA);
    const before = await auditCountBy(ctx.db, stewardId, 'user');
    const move = await steward.patch(`/api/admin/people/${p.id}`).send({ clinicId: clinicB });
    expect(move.status).toBe(200);
    expect(move.body).toMatchObject({ clinicId: clinicB, role: 'clinician' });
    expect(await auditCountBy(ctx.db, stewardId, 'user')).toBe(before + 1);
    const promote = await steward.patch(`/api/admin/people/${p.id}`).send({ role: 'lead' });
    expect(promote.body).toMatchObject({ clinicId: clinicB, role: 'lead' });
    expect(await auditCountBy(ctx.db, stewardId, 'user')).toBe(before + 2);
    const researcher = await steward.patch(`/api/admin/people/${p.id}`).send({ role: 'researcher', clinicId: null });
    expect(researcher.body).toMatchObject({ clinicId: null, role: 'researcher' });
    expect(await auditCountBy(ctx.db, stewardId, 'user')).toBe(before + 3);
  });

  it('refuses inconsistent changes with a clear error and changes nothing', async () => {
    const p = await createUser(ctx.db, 'clinician', clinicA);
    const before = await auditCountBy(ctx.db, stewardId, 'user');
    const noClinic = await steward.patch(`/api/admin/people/${p.id}`).send({ clinicId: null });
    expect(noClinic.status).toBe(422);
    const researcherWithClinic = await steward.patch(`/api/admin/people/${p.id}`).send({ role: 'researcher' });
    expect(researcherWithClinic.status).toBe(422);
    expect(researcherWithClinic.body.error.message).toMatch(/belong to no clinic/);
    const gone = await createClinic(ctx.db);
    await steward.post(`/api/admin/clinics/${gone.id}/deactivate`);
    expect((await steward.patch(`/api/admin/people/${p.id}`).send({ clinicId: gone.id })).status).toBe(422);
    expect((await steward.patch(`/api/admin/people/${stewardId}`).send({ role: 'researcher' })).status).toBe(403);
    expect((await steward.patch('/api/admin/people/99999999').send({ role: 'lead' })).status).toBe(404);
    const [row] = await ctx.db.select().from(users).where(eq(users.id, p.id));
    expect(row).toMatchObject({ role: 'clinician', clinicId: clinicA });
    expect(await auditCountBy(ctx.db, stewardId, 'user')).toBe(before);
  });

  it('a lead cannot change roles or clinics', async () => {
    const p = await createUser(ctx.db, 'clinician', clinicA);
    expect((await lead.patch(`/api/admin/people/${p.id}`).send({ role: 'lead' })).status).toBe(403);
  });
});
