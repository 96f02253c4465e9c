import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { useAdminInstruments } from '../features/admin/api/list-instruments';
import { ConsoleFrame } from '../features/admin/components/console-frame';
import { Panel } from '../features/admin/components/panel';
import { InstrumentCreateForm } from '../features/admin/instruments/instrument-create-form';
import { InstrumentsTable } from '../features/admin/instruments/instruments-table';

/** Registry console › Instruments: the outcome measures, their ranges, directions and MCIDs. */
export function Component() {
  const { data, error, refetch } = useAdminInstruments();
  return (
    <ConsoleFrame
      title="Instruments"
      intro="The outcome measures clinics score. Only totals are stored. A measure that holds scores cannot be deleted, only retired, and its range can grow but never shrink past the scores already stored."
    >
      {error ? (
        <ErrorNotice error={error} title="The instruments could not be loaded" onRetry={() => void refetch()} />
      ) : !data ? (
        <Loading label="Loading the instruments…" />
      ) : (
        <InstrumentsTable instruments={data.items} />
      )}
      <Panel title="Add an instrument">
        <InstrumentCreateForm />
      </Panel>
    </ConsoleFrame>
  );
}
