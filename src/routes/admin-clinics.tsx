import { EmptyState } from '../components/empty-state';
import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { useAdminClinics } from '../features/admin/api/list-clinics';
import { ClinicCreateForm } from '../features/admin/clinics/clinic-form';
import { ClinicsTable } from '../features/admin/clinics/clinics-table';
import { ConsoleFrame } from '../features/admin/components/console-frame';
import { Panel } from '../features/admin/components/panel';

/** Registry console › Clinics: who submits, how complete their follow-up is, and when they last sent data. */
export function Component() {
  const { data, error, isPending, refetch } = useAdminClinics();
  return (
    <ConsoleFrame
      title="Clinics"
      intro="The clinics that submit episodes. Follow-up completeness counts episodes whose week-12 window has closed and says how many have a week-12 assessment."
    >
      {error ? (
        <ErrorNotice error={error} title="The clinics could not be loaded" onRetry={() => void refetch()} />
      ) : isPending ? (
        <Loading label="Loading the clinics…" />
      ) : data.items.length === 0 ? (
        <EmptyState title="No clinics yet">Add the first clinic below; its lead can then be invited from People.</EmptyState>
      ) : (
        <ClinicsTable clinics={data.items} />
      )}
      <Panel title="Add a clinic">
        <ClinicCreateForm />
      </Panel>
    </ConsoleFrame>
  );
}
