import { sql } from 'drizzle-orm';
import type { ClinicSummary } from '../../../shared/schemas/admin';
import type { Db } from '../../db/client';
import { currentRules } from '../rules.service';
import { iso } from './common';

type Row = {
  id: number;
  code: string;
  display_name: string;
  region: string;
  active: boolean;
  created_at: Date;
  active_users: number;
  episodes: number;
  open_episodes: number;
  past_window: number;
  with_week12: number;
  last_submission_at: Date | null;
};

/**
 * Every clinic with its running figures. Follow-up completeness is the share of episodes whose week-12
 * window (from the current rules) has closed that have a week-12 assessment; the last submission is the
 * newest episode, assessment or committed upload.
 */
export async function clinicSummaries(db: Db, clinicId?: number): Promise<ClinicSummary[]> {
  const { rules } = await currentRules(db);
  const toDay = rules.followUpWindows.week12.toDay;
  const result = await db.execute<Row>(sql`
    select c.id, c.code, c.display_name, c.region, c.active, c.created_at,
      (select count(*)::int from app_user u where u.clinic_id = c.id and u.active) as active_users,
      coalesce(e.episodes, 0) as episodes, coalesce(e.open_episodes, 0) as open_episodes,
      coalesce(e.past_window, 0) as past_window, coalesce(e.with_week12, 0) as with_week12,
      greatest(e.last_episode, e.last_assessment,
        (select max(up.created_at) from upload up where up.clinic_id = c.id and up.status = 'committed')) as last_submission_at
    from clinic c
    left join lateral (
      select count(*)::int as episodes,
        count(*) filter (where ep.status = 'open')::int as open_episodes,
        count(*) filter (where ep.start_date + ${toDay}::int < current_date)::int as past_window,
        count(*) filter (where ep.start_date + ${toDay}::int < current_date and exists (
          select 1 from assessment a where a.episode_id = ep.id and a.timepoint = 'week12'))::int as with_week12,
        max(ep.created_at) as last_episode,
        (select max(a.created_at) from assessment a join episode e2 on e2.id = a.episode_id where e2.clinic_id = c.id) as last_assessment
      from episode ep where ep.clinic_id = c.id
    ) e on true
    ${clinicId === undefined ? sql`` : sql`where c.id = ${clinicId}`}
    order by c.code`);
  return result.rows.map((r) => ({
    id: r.id,
    code: r.code,
    displayName: r.display_name,
    region: r.region,
    active: r.active,
    createdAt: iso(r.created_at)!,
    activeUsers: r.active_users,
    episodes: r.episodes,
    openEpisodes: r.open_episodes,
    pastWeek12Window: r.past_window,
    withWeek12: r.with_week12,
    completeness: r.past_window > 0 ? r.with_week12 / r.past_window : null,
    lastSubmissionAt: iso(r.last_submission_at),
  }));
}
