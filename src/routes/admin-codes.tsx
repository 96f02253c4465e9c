import { EmptyState } from '../components/empty-state';
import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { useChangeCode } from '../features/admin/api/change-code';
import { useAdminCodes } from '../features/admin/api/list-codes';
import { useProposals, useProposeCode } from '../features/admin/api/proposals';
import { CodeForm } from '../features/admin/codes/code-form';
import { CodesTable } from '../features/admin/codes/codes-table';
import { ConsoleFrame } from '../features/admin/components/console-frame';
import { Panel } from '../features/admin/components/panel';
import { useSession } from '../features/auth';

/** The steward's code list with clinics' proposals. */
function StewardCodes() {
  const codes = useAdminCodes();
  const change = useChangeCode();
  const items = codes.data?.items ?? [];
  const waiting = items.filter((c) => c.status === 'proposed');
  return (
    <ConsoleFrame title="Intervention codes" intro="The core programme and the add-on exercises clinics record, and whether a code is graded in levels 1–3. Clinic leads propose their clinics’ own codes; you accept or decline them.">
      {codes.error ? (
        <ErrorNotice error={codes.error} title="The codes could not be loaded" onRetry={() => void codes.refetch()} />
      ) : !codes.data ? (
        <Loading label="Loading the codes…" />
      ) : (
        <>
          {waiting.length > 0 ? (
            <Panel title={`Proposals waiting (${waiting.length})`}>
              <CodesTable codes={waiting} actions />
            </Panel>
          ) : null}
          <CodesTable codes={items.filter((c) => c.status !== 'proposed')} actions />
        </>
      )}
      <Panel title="Add a code">
        <CodeForm mode="add" submit={(input) => change.mutateAsync({ kind: 'create', input })} error={change.error} saved={change.isSuccess} />
      </Panel>
    </ConsoleFrame>
  );
}

/** A clinic lead's proposals and the form to make one. */
function LeadProposals() {
  const proposals = useProposals();
  const propose = useProposeCode();
  return (
    <ConsoleFrame title="Code proposals" intro="Codes your clinic uses that the registry does not have yet. The registry steward accepts or declines each proposal; accepted codes can then be recorded on episodes.">
      {proposals.error ? (
        <ErrorNotice error={proposals.error} title="Your proposals could not be loaded" onRetry={() => void proposals.refetch()} />
      ) : !proposals.data ? (
        <Loading label="Loading your proposals…" />
      ) : proposals.data.items.length === 0 ? (
        <EmptyState title="No proposals yet">Propose a code below when your clinic records something the registry has no code for.</EmptyState>
      ) : (
        <CodesTable codes={proposals.data.items} actions={false} />
      )}
      <Panel title="Propose a code">
        <CodeForm mode="propose" submit={(input) => propose.mutateAsync(input)} error={propose.error} saved={propose.isSuccess} />
      </Panel>
    </ConsoleFrame>
  );
}

/** Registry console › Codes: the steward's list, or a clinic lead's proposals. */
export function Component() {
  const { user } = useSession();
  return user?.role === 'lead' ? <LeadProposals /> : <StewardCodes />;
}
