import type { RecoveryGroup, RecoveryResponse } from '../../../../shared/schemas/analytics';
import { count, pct, pctInterval, pValue, weeks, weeksInterval } from '../format';
import { levelLabel, SUBGROUP_LABELS } from '../labels';

/** The table beside the recovery curves: one row per level, too-small levels said in words. */
export function RecoveryGroupsTable({ data, groups }: { data: RecoveryResponse; groups: RecoveryGroup[] }) {
  const min = data.meta.minCellShown;
  const rows = [...groups, data.overall];
  return (
    <div className="relative overflow-x-auto rounded border border-line bg-surface">
      <table className="tabular w-full text-left text-sm" data-testid="recovery-table">
        <caption className="px-4 pt-3 text-left text-sm font-medium text-ink">
          Recovery by {SUBGROUP_LABELS[data.groupBy].toLowerCase()}
        </caption>
        <thead className="border-b border-line text-xs text-ink-soft">
          <tr>
            <th scope="col" className="px-3 py-2 font-medium">
              Group
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              Episodes
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              Recovered
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              Censored
            </th>
            <th scope="col" className="px-3 py-2 text-right font-medium">
              Median weeks (95% CI)
            </th>
            {data.weeks.map((w) => (
              <th key={w} scope="col" className="px-3 py-2 text-right font-medium">
                By week {w}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((g) => (
            <tr
              key={g.level}
              className={`border-b border-line last:border-0 ${g.level === 'all' ? 'bg-canvas font-medium' : ''}`}
              data-level={g.level}
            >
              <th scope="row" className="px-3 py-2 font-normal text-ink">
                {levelLabel(g.level)}
              </th>
              <td className="px-3 py-2 text-right">{count(g.n, min)}</td>
              {g.tooFew ? (
                <td colSpan={3 + data.weeks.length} className="px-3 py-2 text-ink-soft">
                  Too few to estimate (fewer than {data.meta.minCellEstimate} episodes)
                </td>
              ) : (
                <>
                  <td className="px-3 py-2 text-right">{count(g.recovered, min)}</td>
                  <td className="px-3 py-2 text-right">{count(g.censored, min)}</td>
                  <td className="px-3 py-2 text-right">
                    {weeks(g.median?.estimate)} <span className="text-ink-faint">({weeksInterval(g.median)})</span>
                  </td>
                  {g.atWeeks.map((a) => (
                    <td key={a.weeks} className="px-3 py-2 text-right">
                      {a.estimate === null ? 'beyond follow-up' : pct(a.estimate)}{' '}
                      <span className="text-ink-faint">{a.estimate === null ? '' : `(${pctInterval(a)})`}</span>
                    </td>
                  ))}
                </>
              )}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="px-4 py-3 text-xs text-ink-soft" data-testid="log-rank">
        {data.logRank
          ? `Log-rank test across the groups with enough episodes: χ² ${data.logRank.chiSquare.toFixed(2)} on ${data.logRank.df} df, p ${pValue(data.logRank.pValue)}.`
          : `No log-rank test: ${data.logRankNote ?? 'not computable'}.`}
      </p>
    </div>
  );
}
