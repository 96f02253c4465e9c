import { sql } from 'drizzle-orm';
import type { Db } from '../../server/db/client';

/**
 * A fast stand-in for the demo generator: invented episodes written with set-based SQL (generate_series), for
 * when only the export's speed matters. Six fictional clinics in two regions; every episode has a baseline and
 * three follow-ups with four scores each, and one to three interventions. Values vary deterministically with the
 * row number. Nothing here describes a real person or clinic.
 */
export async function ownSeed(db: Db, episodes: number): Promise<void> {
  await db.execute(sql`insert into clinic (code, display_name, region)
    select 'B' || g, 'Bench Clinic ' || g, case when g <= 3 then 'Bench North' else 'Bench South' end from generate_series(1, 6) g`);
  await db.execute(sql`insert into episode (clinic_id, pseudonym, reference, condition_code, side, start_date, symptom_weeks,
      age_years, sex, height_cm, weight_kg, activity_profile, standing_work, research_consent, status)
    select (select id from clinic where code = 'B' || (1 + g % 6)), encode(sha256(('bench-' || g)::bytea), 'hex'), 'BE-' || g,
      'plantar-heel-pain', (array['left','right','both'])[1 + g % 3], date '2023-01-02' + (g * 37) % 900, (g * 7) % 90,
      18 + (g * 13) % 70, case when g % 50 = 0 then 'other' when g % 2 = 0 then 'female' else 'male' end,
      150 + (g * 7) % 45, 50 + (g * 11) % 65, (array['runner','active','sedentary'])[1 + (g / 7) % 3], g % 3 = 0, g % 10 <> 0, 'open'
    from generate_series(1, ${episodes}) g`);
  await db.execute(sql`insert into assessment (episode_id, assessed_on, timepoint, reporter)
    select e.id, e.start_date + v.day + (e.id % 9) * (v.day > 0)::int, v.tp, 'clinician'
    from episode e cross join (values (0, 'baseline'), (42, 'week6'), (84, 'week12'), (182, 'week26')) as v(day, tp)
    where e.reference like 'BE-%'`);
  await db.execute(sql`insert into score (assessment_id, instrument_id, value)
    select a.id, i.id, case i.code
        when 'nprs-first-step' then greatest(0, 8 - (a.assessed_on - e.start_date) / (14 + e.id % 20))
        when 'nprs-usual' then greatest(0, 7 - (a.assessed_on - e.start_date) / (16 + e.id % 20))
        when 'lefs' then least(80, 35 + (a.assessed_on - e.start_date) / 7)
        else least(100, 50 + (a.assessed_on - e.start_date) / 4) end
    from assessment a join episode e on e.id = a.episode_id
    cross join instrument i where i.code in ('nprs-first-step', 'nprs-usual', 'lefs', 'faam-adl') and e.reference like 'BE-%'`);
  await db.execute(sql`insert into episode_intervention (episode_id, intervention_code_id, start_week)
    select e.id, c.id, 0 from episode e join intervention_code c
      on c.code = 'education-load' or (c.code = 'toe-flexor' and e.id % 3 = 0) or (c.code = 'taping' and e.id % 4 = 0)
    where e.reference like 'BE-%'`);
}
