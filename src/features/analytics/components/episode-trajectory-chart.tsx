import { useId, useState } from 'react';
import { ChartFrame } from '../../../charts/chart-frame';
import { ChartTable } from '../../../charts/chart-table';
import { trajectorySpec } from '../../../charts/specs/trajectory-spec';
import { ErrorNotice } from '../../../components/error-notice';
import { useTrajectory } from '../api/get-trajectory';
import { dec1, int } from '../format';

type Row = {
  weeks: number;
  assessedOn: string;
  timepoint: string;
  value: number | null;
  steps: number | null;
  flag: string;
};

/**
 * One episode's course for the episode screen: the chosen score over weeks with the band within one MCID of
 * baseline, average daily steps beneath, and a mark where first-step pain rose by 2 or more since the previous
 * assessment (a prompt for the clinician to look, common practice; not advice). The Vega code loads lazily.
 */
export function EpisodeTrajectoryChart({ episodeId }: { episodeId: number }) {
  const q = useTrajectory(episodeId);
  const [code, setCode] = useState('nprs-first-step');
  const selectId = useId();
  if (q.isPending)
    return (
      <p role="status" className="animate-pulse py-6 text-sm text-ink-faint">
        Loading the course of care…
      </p>
    );
  if (q.isError)
    return <ErrorNotice error={q.error} title="The course of care could not be loaded" onRetry={() => q.refetch()} />;
  const data = q.data;
  if (data.instruments.length === 0) {
    return (
      <p className="rounded border border-dashed border-line bg-surface px-4 py-6 text-sm text-ink-soft">
        No scores recorded for this episode yet.
      </p>
    );
  }
  const series = data.instruments.find((i) => i.instrument.code === code) ?? data.instruments[0]!;
  const stepsByDate = new Map(data.steps.map((s) => [s.assessedOn, s.steps]));
  const flagged = new Set(series.instrument.code === 'nprs-first-step' ? data.flags.map((f) => f.assessedOn) : []);
  const rows: Row[] = series.points.map((p) => ({
    weeks: p.weeks,
    assessedOn: p.assessedOn,
    timepoint: p.timepoint,
    value: p.value,
    steps: stepsByDate.get(p.assessedOn) ?? null,
    flag: flagged.has(p.assessedOn) ? `rose by ${data.riseThreshold} or more` : '',
  }));
  const summary = `${series.instrument.label} over ${rows.length} assessments: ${rows.map((r) => `week ${dec1(r.weeks)} ${r.value}`).join(', ')}.${
    series.mcidLevel !== null ? ` One MCID from the baseline of ${series.baseline} is ${series.mcidLevel}.` : ''
  }${flagged.size ? ` First-step pain rose by ${data.riseThreshold} or more at ${flagged.size} follow-up${flagged.size === 1 ? '' : 's'}.` : ''}`;
  return (
    <div className="space-y-3">
      {data.instruments.length > 1 ? (
        <div className="flex items-center gap-2 text-sm">
          <label htmlFor={selectId} className="text-ink-soft">
            Score shown
          </label>
          <select
            id={selectId}
            value={series.instrument.code}
            onChange={(e) => setCode(e.target.value)}
            className="rounded border border-line bg-surface px-2 py-1"
          >
            {data.instruments.map((i) => (
              <option key={i.instrument.code} value={i.instrument.code}>
                {i.instrument.label}
              </option>
            ))}
          </select>
        </div>
      ) : null}
      <ChartFrame
        testId="chart-trajectory"
        title="Scores and daily steps over the weeks of care"
        note={`Shaded: within one MCID (${series.instrument.mcid ?? 'none'}) of baseline. Triangles: first-step pain up by ${data.riseThreshold} or more since the previous assessment (a prompt to look, common practice).`}
        summary={summary}
        fileName={`loadline-episode-${data.episode.reference}`}
        spec={trajectorySpec(series, data, summary)}
        minHeight={360}
        table={
          <ChartTable<Row>
            caption={`${series.instrument.label} and daily steps by assessment`}
            rowKey={(r) => `${r.assessedOn}-${r.timepoint}`}
            rows={rows}
            columns={[
              { header: 'Date', cell: (r) => r.assessedOn },
              { header: 'Week', cell: (r) => dec1(r.weeks), numeric: true },
              { header: 'Timepoint', cell: (r) => r.timepoint },
              { header: 'Score', cell: (r) => (r.value === null ? '–' : String(r.value)), numeric: true },
              { header: 'Daily steps', cell: (r) => int(r.steps), numeric: true },
              { header: 'Flag', cell: (r) => r.flag },
            ]}
          />
        }
      />
    </div>
  );
}
