import type { EpisodeDetail } from '../../../../shared/schemas/episode';
import type { InstrumentInfo } from '../../../../shared/schemas/reference';
import { Sparkline } from '../../../components/sparkline';
import { baselineOf, changeFromBaseline, weeksOf } from '../change';
import { formatChange, formatDate, formatNumber } from '../format';
import { REPORTER_LABELS, TIMEPOINT_LABELS } from '../labels';
import { TableFrame } from '../../../components/table-frame';

type Props = { episode: EpisodeDetail; instruments: InstrumentInfo[] };

function ChangeNote({
  baseline,
  value,
  instrument,
}: {
  baseline: number | undefined;
  value: number;
  instrument: InstrumentInfo;
}) {
  const c = changeFromBaseline(baseline, value, instrument);
  if (!c) return null;
  return (
    <span className="block text-xs">
      <span className="text-ink-soft">{formatChange(c.change)} since start</span>
      {c.reachedMcid === null ? null : c.reachedMcid ? (
        <span className="ml-1 rounded bg-good/10 px-1 text-good">reached MCID ({instrument.mcid})</span>
      ) : (
        <span className="ml-1 text-ink-faint">below MCID ({instrument.mcid})</span>
      )}
    </span>
  );
}

/** Every assessment with its scores; follow-ups show the change since the start and whether it reaches the MCID. */
export function ScoreHistory({ episode, instruments }: Props) {
  const used = instruments.filter((i) => episode.assessments.some((a) => a.scores[i.code] !== undefined));
  const baseline = baselineOf(episode.assessments);
  const rows = [...episode.assessments].sort((a, b) => a.daysSinceStart - b.daysSinceStart || a.id - b.id);
  return (
    <div className="space-y-5">
      {used.length > 0 ? (
        <ul className="flex flex-wrap gap-6" aria-label="Score trajectories">
          {used.map((i) => (
            <li key={i.code} className="space-y-1">
              <p className="text-xs text-ink-soft">{i.label}</p>
              <Sparkline
                label={i.label}
                min={i.min}
                max={i.max}
                points={rows.flatMap((a) =>
                  a.scores[i.code] === undefined
                    ? []
                    : [{ weeks: weeksOf(a.daysSinceStart), value: a.scores[i.code]! }],
                )}
              />
            </li>
          ))}
        </ul>
      ) : null}
      <TableFrame
        caption="Assessments and scores of this episode"
        cell="px-4 py-2"
        columns={['Assessment', 'Date', ...used.map((i) => ({ key: i.code, label: i.label })), 'Daily steps']}
      >
        {rows.map((a) => (
          <tr key={a.id} className="border-b border-line last:border-0">
            <th scope="row" className="px-4 py-2.5 text-left align-top font-medium">
              {TIMEPOINT_LABELS[a.timepoint]}
              <span className="block text-xs font-normal text-ink-faint">{REPORTER_LABELS[a.reporter]}</span>
            </th>
            <td className="px-4 py-2.5 align-top">
              {formatDate(a.assessedOn)}
              <span className="block text-xs text-ink-faint">week {weeksOf(a.daysSinceStart)}</span>
            </td>
            {used.map((i) => {
              const v = a.scores[i.code];
              return (
                <td key={i.code} className="px-4 py-2.5 align-top">
                  {formatNumber(v)}
                  {v !== undefined && a.timepoint !== 'baseline' ? (
                    <ChangeNote baseline={baseline?.scores[i.code]} value={v} instrument={i} />
                  ) : null}
                </td>
              );
            })}
            <td className="px-4 py-2.5 align-top">{formatNumber(a.avgDailySteps, 0)}</td>
          </tr>
        ))}
      </TableFrame>
      <p className="text-xs text-ink-faint">
        “+” means better for every instrument (less pain, more function). MCIDs and their sources come from the
        registry’s instrument list. These figures describe what was recorded; they are not treatment advice and do not
        replace clinical judgement.
      </p>
    </div>
  );
}
