import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { asc, eq } from 'drizzle-orm';
import { clinics, conditions, registryRules } from '../../server/db/schema';
import { DEFAULT_RULES } from '../../shared/rules';
import { InstrumentInfoListSchema, InterventionInfoListSchema, PseudonymSaltSchema } from '../../shared/schemas/reference';
import { testApp } from '../setup/test-app';
import { createUser, signedInClient, type Client } from '../setup/auth';
import { createClinic } from './episodes-fixtures';

const ctx = testApp();
let clinicId: number;
let clinician: Client;
afterAll(() => ctx.close());
beforeAll(async () => {
  clinicId = (await createClinic(ctx.db, 'REF')).id;
  clinician = await signedInClient(ctx.app, (await createUser(ctx.db, 'clinician', clinicId)).email);
});

describe('reference data (migration 0005) and its routes', () => {
  it('ships plantar heel pain as ICD-10 M72.2', async () => {
    expect(await ctx.db.select().from(conditions).where(eq(conditions.code, 'plantar-heel-pain'))).toEqual([
      { code: 'plantar-heel-pain', label: 'Plantar heel pain', icd10: 'M72.2' },
    ]);
  });

  it('lists the instruments with range, direction and MCID as in the domain sources', async () => {
    const list = InstrumentInfoListSchema.parse((await clinician.get('/api/instruments')).body);
    const by = Object.fromEntries(list.items.map((i) => [i.code, [i.min, i.max, i.higherIsBetter, i.mcid]]));
    // Farrar 2001 / Salaffi 2004 (NPRS 2), Martin 2005 (FAAM ADL 8), Binkley 1999 (LEFS 9), Abbott & Schmitt 2014 (PSFS 2.3)
    expect(by).toMatchObject({
      'nprs-first-step': [0, 10, false, 2],
      'nprs-usual': [0, 10, false, 2],
      'faam-adl': [0, 100, true, 8],
      lefs: [0, 80, true, 9],
      psfs: [0, 10, true, 2.3],
      groc: [-7, 7, true, null],
    });
    expect(list.items.find((i) => i.code === 'groc')!.mcidSource).toMatch(/anchor/);
  });

  it('lists accepted intervention codes, core first, with the graded ones marked', async () => {
    const list = InterventionInfoListSchema.parse((await clinician.get('/api/interventions')).body);
    expect(list.items.slice(0, 3).map((i) => i.kind)).toEqual(['core', 'core', 'core']);
    const graded = list.items.filter((i) => i.graded).map((i) => i.code);
    expect(graded).toEqual(expect.arrayContaining(['heel-raises', 'split-squats', 'single-leg-balance']));
    expect(list.items.find((i) => i.code === 'taping')!.graded).toBe(false);
  });

  it('stores version 1 of the registry rules equal to the shipped defaults', async () => {
    const [v1] = await ctx.db.select().from(registryRules).orderBy(asc(registryRules.version)).limit(1);
    expect(v1).toMatchObject({ version: 1, reason: 'Shipped defaults (registry settings, not published norms)' });
    expect(v1!.rules).toEqual(DEFAULT_RULES);
  });

  it('gives a clinic its own 16-byte salt, different from another clinic’s', async () => {
    const res = await clinician.get('/api/clinics/current/pseudonym-salt');
    expect(res.status).toBe(200);
    const salt = PseudonymSaltSchema.parse(res.body);
    expect(salt).toMatchObject({ clinicId, iterations: 310_000 });
    const [row] = await ctx.db.select({ s: clinics.pseudonymSalt }).from(clinics).where(eq(clinics.id, clinicId));
    expect(salt.salt).toBe(row!.s);
    const other = await createClinic(ctx.db, 'REF2');
    expect(other.pseudonymSalt).toMatch(/^[0-9a-f]{32}$/);
    expect(other.pseudonymSalt).not.toBe(salt.salt);
  });
});
