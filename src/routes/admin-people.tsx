import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { Person } from '../../shared/schemas/admin';
import { DataTable } from '../components/data-table';
import { EmptyState } from '../components/empty-state';
import { ErrorNotice } from '../components/error-notice';
import { Loading } from '../components/loading';
import { useAdminClinics } from '../features/admin/api/list-clinics';
import { usePeople } from '../features/admin/api/list-people';
import { ConsoleFrame } from '../features/admin/components/console-frame';
import { Panel } from '../features/admin/components/panel';
import { InviteForm } from '../features/admin/people/invite-form';
import { peopleColumns } from '../features/admin/people/people-columns';
import { PeopleFilters } from '../features/admin/people/people-filters';
import { PEOPLE_PAGE_SIZE, readPeopleState, toPeopleQuery, writePeopleState, type PeopleState } from '../features/admin/people/people-params';
import { PersonEditor } from '../features/admin/people/person-editor';
import { useSession } from '../features/auth';

/** Registry console › People (steward: everyone; clinic lead: the clinicians of their clinic). */
export function Component() {
  const { user } = useSession();
  const steward = user?.role === 'steward';
  const [params, setParams] = useSearchParams();
  const state = readPeopleState(params);
  const update = (next: Partial<PeopleState>) => setParams(writePeopleState({ ...state, ...next }));
  const people = usePeople(toPeopleQuery(state));
  const clinics = useAdminClinics(steward);
  const [editing, setEditing] = useState<Person | null>(null);
  const columns = useMemo(() => peopleColumns({ canChange: steward, selfId: user?.id ?? null, onChange: setEditing }), [steward, user?.id]);
  const clinicList = clinics.data?.items ?? [];

  return (
    <ConsoleFrame
      title={steward ? 'People' : 'Your clinic’s team'}
      intro={
        steward
          ? 'Everyone with an account: invite stewards, researchers and clinic leads, change a role, move someone to another clinic, or end their access.'
          : 'The clinicians of your clinic: invite a new one, send an invitation again, or end someone’s access.'
      }
    >
      {editing ? (
        <Panel title="Change role or clinic">
          <PersonEditor key={editing.id} person={editing} clinics={clinicList} onDone={() => setEditing(null)} />
        </Panel>
      ) : null}
      <PeopleFilters state={state} update={update} clinics={clinicList} steward={steward} />
      {people.error ? (
        <ErrorNotice error={people.error} title="The people could not be loaded" onRetry={() => void people.refetch()} />
      ) : !people.data ? (
        <Loading label="Loading people…" />
      ) : (
        <DataTable
          caption={steward ? 'People of the registry' : 'Clinicians of your clinic'}
          columns={columns}
          data={people.data.items}
          total={people.data.total}
          getRowId={(p) => String(p.id)}
          pagination={{ pageIndex: state.page - 1, pageSize: PEOPLE_PAGE_SIZE }}
          onPaginationChange={(p) => update({ page: p.pageIndex + 1 })}
          sorting={[]}
          onSortingChange={() => undefined}
          busy={people.isFetching}
          empty={<EmptyState title="Nobody matches">Try another filter, or invite someone below.</EmptyState>}
        />
      )}
      {user?.role === 'steward' || user?.role === 'lead' ? (
        <Panel title="Invite someone">
          <InviteForm as={user.role} clinics={clinicList} />
        </Panel>
      ) : null}
    </ConsoleFrame>
  );
}
