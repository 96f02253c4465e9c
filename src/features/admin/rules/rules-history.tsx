import type { RulesVersion } from '../../../../shared/schemas/admin';
import { formatWhen } from '../format';
import { ruleLabel, ruleValue } from './rules-labels';

/** Every version of the rules, newest first: who changed what, when and why. Old versions are never removed. */
export function RulesHistory({ history, currentVersion }: { history: RulesVersion[]; currentVersion: number }) {
  return (
    <ol className="space-y-4" aria-label="Versions of the registry rules">
      {history.map((v) => (
        <li key={v.version} className="rounded border border-line bg-surface p-4">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h3 className="font-medium">
              Version {v.version}
              {v.version === currentVersion ? (
                <span className="ml-2 rounded-full bg-accent-tint px-2 py-0.5 text-xs text-accent-strong">
                  in force
                </span>
              ) : null}
            </h3>
            <p className="text-xs text-ink-faint">
              {v.changedAt
                ? `${formatWhen(v.changedAt)} · ${v.changedByName ?? 'set at installation'}`
                : 'Shipped with Loadline'}
            </p>
          </div>
          <p className="mt-1 text-sm text-ink-soft">{v.reason}</p>
          {v.changes.length > 0 ? (
            <ul className="mt-2 space-y-0.5 text-sm">
              {v.changes.map((c) => (
                <li key={c.path}>
                  <span className="text-ink-soft">{ruleLabel(c.path)}:</span>{' '}
                  <span className="tabular">
                    {ruleValue(c.path, c.from)} → <strong className="font-medium">{ruleValue(c.path, c.to)}</strong>
                  </span>
                </li>
              ))}
            </ul>
          ) : null}
        </li>
      ))}
    </ol>
  );
}
