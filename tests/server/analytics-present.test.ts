import { describe, expect, it } from 'vitest';
import { presentClinics } from '../../server/services/analytics/clinics.service';

// The per-request view of the peer comparison, applied after the cache (a pure function: no database needed).
describe('presentClinics (what each viewer may see of the comparison)', () => {
  const m = (n: number, count: number) => ({
    n,
    count,
    share: count / n,
    flag95: 'within' as const,
    flag998: 'within' as const,
  });
  const result = (minCellShown: number | null) =>
    ({
      rulesVersion: 1,
      meta: { minCellShown, subject: { kind: 'registry', clinicId: null, label: 'Whole registry' } },
      clinics: [
        { clinicId: 1, code: 'K1', displayName: 'First', nEpisodes: 40, responder: m(30, 3), recovered: m(30, 15) },
        { clinicId: 2, code: 'K2', displayName: 'Second', nEpisodes: 50, responder: m(40, 38), recovered: m(40, 20) },
      ],
    }) as unknown as Parameters<typeof presentClinics>[0];

  it('hides a researcher’s small cells (and their complements) but not the steward’s', () => {
    const research = presentClinics(result(5), { kind: 'registry', researcher: true, userId: 1 });
    const first = research.clinics.find((c) => c.nEpisodes === 40)!;
    const second = research.clinics.find((c) => c.nEpisodes === 50)!;
    expect([first.responder.count, first.responder.share, first.recovered.count]).toEqual([null, null, 15]);
    expect([second.responder.count, second.responder.flag998]).toEqual([null, null]); // 40 − 38 = 2 is small
    expect(research.clinics.every((c) => c.name === null && !c.highlighted)).toBe(true);
    const steward = presentClinics(result(null), { kind: 'registry', researcher: false, userId: 1 });
    expect(steward.clinics.map((c) => [c.label, c.name, c.responder.count])).toEqual([
      ['K1', 'First', 3],
      ['K2', 'Second', 38],
    ]);
  });

  it('names only the lead’s own clinic', () => {
    const lead = presentClinics(result(null), { kind: 'clinic', clinicId: 2, userId: 1 });
    expect(lead.clinics.map((c) => [c.label.replace(/\d+$/, 'N'), c.highlighted, c.name])).toEqual([
      ['Peer N', false, null],
      ['Your clinic (K2)', true, null],
    ]);
  });
});
