import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { useAdminInstruments } from '../features/admin/api/list-instruments';
import { useAdminRules } from '../features/admin/api/get-rules';
import { ConsoleFrame } from '../features/admin/components/console-frame';
import { Panel } from '../features/admin/components/panel';
import { formatWhen } from '../features/admin/format';
import { RulesForm } from '../features/admin/rules/rules-form';
import { RulesHistory } from '../features/admin/rules/rules-history';

/** Registry console › Rules: the one versioned settings record every computation reads. */
export function Component() {
  const rules = useAdminRules();
  const instruments = useAdminInstruments();
  const error = rules.error ?? instruments.error;
  return (
    <ConsoleFrame
      title="Registry rules"
      intro="What counts as recovered, which follow-up is primary, the three-month expectation and the limits on small numbers. Every change becomes a new version with its reason; earlier versions stay, so earlier numbers can be recomputed as they were."
    >
      {error ? (
        <ErrorNotice error={error} title="The rules could not be loaded" onRetry={() => void Promise.all([rules.refetch(), instruments.refetch()])} />
      ) : !rules.data || !instruments.data ? (
        <Loading label="Loading the rules…" />
      ) : (
        <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
          <Panel
            title={`In force: version ${rules.data.current.version}`}
            aside={<span className="text-xs text-ink-faint">{rules.data.current.changedAt ? `since ${formatWhen(rules.data.current.changedAt)}` : 'shipped defaults'}</span>}
          >
            {/* Re-mount on a new version so the form starts from what is now stored. */}
            <RulesForm key={rules.data.current.version} current={rules.data.current} instruments={instruments.data.items} />
          </Panel>
          <div className="space-y-3">
            <h2 className="text-base font-semibold">History</h2>
            <RulesHistory history={rules.data.history} currentVersion={rules.data.current.version} />
          </div>
        </div>
      )}
    </ConsoleFrame>
  );
}
