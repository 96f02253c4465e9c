import type { Completeness } from '../../../shared/schemas/follow-ups';
import { ErrorNotice } from '../../components/error-notice';
import { Loading } from '../../components/loading';
import { formatDate } from '../episodes/format';
import { useCompleteness } from './api/get-completeness';
import { FOLLOW_UP_LABELS } from './labels';

const pct = (share: number | null) => (share === null ? '–' : `${Math.round(share * 100)}%`);

const W = 520;
const LABEL = 90;
const BAR = 14;
const ROW = 52;

/** Horizontal bars (clinic, registry) per timepoint with the target as a dashed line. */
function CompletenessBars({ data }: { data: Completeness }) {
  const x = (share: number) => LABEL + share * (W - LABEL - 40);
  const h = data.timepoints.length * ROW + 24;
  const summary = data.timepoints
    .map((t) => `${FOLLOW_UP_LABELS[t.timepoint]}: clinic ${pct(t.clinic.share)}, registry ${pct(t.registry.share)}`)
    .join('; ');
  return (
    <svg
      viewBox={`0 0 ${W} ${h}`}
      className="w-full max-w-xl"
      role="img"
      aria-label={`Completeness against the ${pct(data.target)} target. ${summary}`}
    >
      {data.timepoints.map((t, i) => {
        const y = i * ROW + 8;
        return (
          <g key={t.timepoint}>
            <text x={0} y={y + BAR + 4} className="fill-ink text-[12px]">
              {FOLLOW_UP_LABELS[t.timepoint]}
            </text>
            <rect x={LABEL} y={y} width={W - LABEL - 40} height={BAR} className="fill-canvas" />
            <rect x={LABEL} y={y} width={x(t.clinic.share ?? 0) - LABEL} height={BAR} className="fill-accent" />
            <text x={x(t.clinic.share ?? 0) + 4} y={y + BAR - 3} className="fill-ink-soft text-[11px]">
              {pct(t.clinic.share)}
            </text>
            <rect x={LABEL} y={y + BAR + 4} width={W - LABEL - 40} height={BAR} className="fill-canvas" />
            <rect
              x={LABEL}
              y={y + BAR + 4}
              width={x(t.registry.share ?? 0) - LABEL}
              height={BAR}
              className="fill-ink-faint"
            />
            <text x={x(t.registry.share ?? 0) + 4} y={y + 2 * BAR + 1} className="fill-ink-soft text-[11px]">
              {pct(t.registry.share)}
            </text>
          </g>
        );
      })}
      <line
        x1={x(data.target)}
        x2={x(data.target)}
        y1={0}
        y2={h - 18}
        strokeDasharray="4 3"
        className="stroke-caution"
        strokeWidth={2}
      />
      <text x={x(data.target)} y={h - 4} textAnchor="middle" className="fill-caution text-[11px]">
        target {pct(data.target)}
      </text>
    </svg>
  );
}

/** The lead's view: how many expected follow-ups were recorded, the clinic against the registry as a whole. */
export function CompletenessPanel() {
  const { data, error, isPending, refetch } = useCompleteness(true);
  return (
    <section aria-labelledby="completeness-title" className="space-y-3 rounded border border-line bg-surface p-5">
      <h2 id="completeness-title" className="text-lg font-semibold">
        Follow-ups recorded, last 12 months
      </h2>
      {error ? (
        <ErrorNotice error={error} title="Completeness could not be loaded" onRetry={() => void refetch()} />
      ) : isPending ? (
        <Loading label="Counting follow-ups…" />
      ) : (
        <>
          <p className="text-sm text-ink-soft">
            Of the follow-ups whose window closed between {formatDate(data.from)} and {formatDate(data.to)}, the share
            with an assessment: <span className="font-medium text-accent-strong">your clinic</span> and{' '}
            <span className="font-medium text-ink-soft">all registry clinics together</span>. Episodes discharged before
            a window opened are not counted; those who stopped coming are.
          </p>
          <CompletenessBars data={data} />
          <table className="tabular w-full max-w-xl text-left text-sm">
            <caption className="sr-only">Follow-up completeness by timepoint</caption>
            <thead className="border-b border-line text-xs text-ink-soft">
              <tr>
                <th scope="col" className="py-1.5 font-medium">
                  Follow-up
                </th>
                <th scope="col" className="py-1.5 font-medium">
                  Your clinic
                </th>
                <th scope="col" className="py-1.5 font-medium">
                  Registry
                </th>
              </tr>
            </thead>
            <tbody>
              {data.timepoints.map((t) => (
                <tr key={t.timepoint} className="border-b border-line last:border-0">
                  <th scope="row" className="py-1.5 font-normal">
                    {FOLLOW_UP_LABELS[t.timepoint]}
                  </th>
                  <td className="py-1.5">
                    {pct(t.clinic.share)}{' '}
                    <span className="text-ink-faint">
                      ({t.clinic.completed} of {t.clinic.expected})
                    </span>
                    {t.clinic.expected > 0 && t.clinic.expected < data.minCell ? (
                      <span className="block text-xs text-caution">few episodes: read with care</span>
                    ) : null}
                  </td>
                  <td className="py-1.5">
                    {pct(t.registry.share)}{' '}
                    <span className="text-ink-faint">
                      ({t.registry.completed} of {t.registry.expected})
                    </span>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="text-xs text-ink-faint">
            The {pct(data.target)} target is the registry’s setting, a common-practice level for outcome registries
            rather than a published standard.
          </p>
        </>
      )}
    </section>
  );
}
