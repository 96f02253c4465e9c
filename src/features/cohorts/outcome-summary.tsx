import type { OutcomeSummary } from '../../../shared/schemas/cohort';
import { countShort, dec1, DASH, pct } from './format';
import { TableFrame } from '../../components/table-frame';

/** The cohort's outcomes from the outcomes engine: change per instrument, responders, time to recovery. */
export function OutcomeSummaryView({ summary }: { summary: OutcomeSummary }) {
  const shown = summary.instruments.filter((i) => i.nPaired !== 0);
  const r = summary.recovery;
  return (
    <div className="space-y-4">
      {shown.length === 0 ? (
        <p className="text-sm text-ink-soft">No episode in this cohort has a baseline and a primary follow-up yet.</p>
      ) : (
        <TableFrame
          caption="Change from baseline to the primary follow-up"
          cell="px-3 py-2"
          columns={[
            'Instrument',
            { label: 'Paired', numeric: true },
            { label: 'Mean change (95% CI)', numeric: true },
            { label: 'Median (IQR)', numeric: true },
            { label: 'Improved by the MCID (95% CI)', numeric: true },
          ]}
        >
          {shown.map((i) => (
            <tr key={i.code} className="border-b border-line last:border-0">
              <th scope="row" className="px-3 py-2 font-normal">
                {i.label}
              </th>
              <td className="px-3 py-2 text-right">{countShort(i.nPaired)}</td>
              <td className="px-3 py-2 text-right">
                {i.change
                  ? `${dec1(i.change.mean)} (${dec1(i.change.lower)} to ${dec1(i.change.upper)})`
                  : `too few (under ${summary.minEstimate})`}
              </td>
              <td className="px-3 py-2 text-right">
                {i.change ? `${dec1(i.change.median)} (${dec1(i.change.q1)}–${dec1(i.change.q3)})` : DASH}
              </td>
              <td className="px-3 py-2 text-right">
                {i.mcid === null
                  ? 'no MCID'
                  : i.responders
                    ? `${pct(i.responders.share.estimate)} (${pct(i.responders.share.lower)}–${pct(i.responders.share.upper)})`
                    : 'hidden (small count)'}
              </td>
            </tr>
          ))}
        </TableFrame>
      )}
      <p className="text-xs text-ink-faint">
        A positive change means improvement on every instrument. Estimates need at least {summary.minEstimate} episodes;
        shares are hidden where they would reveal a small count.
      </p>
      {r ? (
        <div className="rounded border border-line bg-surface p-3 text-sm">
          <p className="font-medium">Time to recovery (Kaplan-Meier, first-step pain at or below {r.threshold})</p>
          <p className="mt-1 text-ink-soft">
            {countShort(r.recovered)} of {countShort(r.n)} recovered during follow-up. Median weeks to recovery:{' '}
            {r.medianWeeks.estimate === null ? 'not reached' : dec1(r.medianWeeks.estimate)}.
          </p>
          <ul className="mt-2 flex flex-wrap gap-4">
            {r.atWeeks.map((w) => (
              <li key={w.weeks}>
                <span className="text-ink-faint">by week {w.weeks}: </span>
                <span className="font-medium">{pct(w.estimate)}</span>
                {w.lower !== null && w.upper !== null ? (
                  <span className="text-ink-faint">
                    {' '}
                    ({pct(w.lower)}–{pct(w.upper)})
                  </span>
                ) : null}
              </li>
            ))}
          </ul>
        </div>
      ) : (
        <p className="text-sm text-ink-soft">Too few episodes for a recovery curve (under {summary.minEstimate}).</p>
      )}
      <p className="text-xs text-ink-faint">
        Observational registry data: differences between cohorts are associations, not effects of care.
      </p>
    </div>
  );
}
