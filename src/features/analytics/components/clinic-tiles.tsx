import type { OutcomesResponse } from '../../../../shared/schemas/analytics';
import { dateTime, int, pct, pctInterval, weeks, weeksInterval } from '../format';
import { PositionBadge, ResultTile } from './result-tile';

/** The five headline figures of the clinic results. */
export function ClinicTiles({ data }: { data: OutcomesResponse }) {
  const t = data.tiles;
  const min = data.meta.minCellEstimate;
  const rec = t.recovered;
  const week = data.targetWeek;
  const setBy = rec.setBy ? `set by ${rec.setBy}` : 'the registry’s shipped setting';
  return (
    <dl className="grid grid-cols-2 gap-3 md:grid-cols-3 xl:grid-cols-5" aria-label="Headline figures">
      <ResultTile
        testId="tile-episodes"
        label="Episodes in the period"
        value={int(t.episodes)}
        detail={`${int(rec.n)} with a score on the recovery measure`}
      />
      <ResultTile
        testId="tile-completeness"
        label={`Week-${week} follow-up`}
        value={pct(t.completeness.share?.estimate)}
        detail={`${int(t.completeness.completed)} of ${int(t.completeness.due)} due · 95% CI ${pctInterval(t.completeness.share)}`}
        info={`Episodes whose week-${week} window (days ${t.completeness.window.fromDay} to ${t.completeness.window.toDay}) has closed, and the share of them with an assessment inside it. The registry aims for ${pct(t.completeness.target)}.`}
      />
      {t.responders ? (
        <ResultTile
          testId="tile-responders"
          label="Responders"
          value={t.responders.share ? pct(t.responders.share.estimate) : 'Too few'}
          detail={
            t.responders.share
              ? `${int(t.responders.responders)} of ${int(t.responders.nAnalysed)} · 95% CI ${pctInterval(t.responders.share)} · ${int(t.responders.nMissingFollowUp)} without a follow-up`
              : `Fewer than ${min} episodes with a follow-up`
          }
          info={`Improvement of at least the MCID (${data.instrument.mcid} ${data.instrument.unit}) on ${data.instrument.label} at the follow-up nearest week ${week}. Episodes without one are counted as missing, not as non-responders. Target ${pct(t.responders.target)}.`}
          badge={<PositionBadge position={t.responders.position} />}
        />
      ) : (
        <ResultTile
          testId="tile-responders"
          label="Responders"
          value="No MCID"
          detail={`${data.instrument.label} has no MCID; choose another instrument`}
        />
      )}
      <ResultTile
        testId="tile-recovered"
        label={`Recovered by week ${week}`}
        value={rec.share ? pct(rec.share.estimate) : 'Too few'}
        detail={
          rec.share ? `95% CI ${pctInterval(rec.share)} · expectation ${pct(rec.target)}` : `Fewer than ${min} episodes`
        }
        info={
          <>
            Kaplan-Meier estimate of the share reaching {data.recoveryRule.instrumentLabel.toLowerCase()}{' '}
            {data.recoveryRule.direction === 'atMost' ? 'at or below' : 'at or above'} {data.recoveryRule.threshold} by
            week {week}. The expectation of {pct(rec.target)} is a registry setting ({setBy}
            {rec.setAt ? `, ${dateTime(rec.setAt)}` : ''}; rules version {data.meta.rulesVersion}), not a published
            norm.
          </>
        }
        badge={<PositionBadge position={rec.position} />}
      />
      <ResultTile
        testId="tile-median"
        label="Median weeks to recovery"
        value={t.medianWeeks ? weeks(t.medianWeeks.estimate) : 'Too few'}
        detail={t.medianWeeks ? `95% CI ${weeksInterval(t.medianWeeks)}` : `Fewer than ${min} episodes`}
      />
    </dl>
  );
}
