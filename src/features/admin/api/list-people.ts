import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { PeopleListSchema, type PeopleQuery } from '../../../../shared/schemas/admin';
import { apiFetch } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { searchOf } from '../search-params';

export const listPeople = (q: PeopleQuery, signal?: AbortSignal) =>
  apiFetch(`/api/admin/people?${searchOf(q)}`, PeopleListSchema, { signal });

export const peopleQueryOptions = (q: PeopleQuery) =>
  queryOptions({
    queryKey: queryKeys.admin.peopleList(q),
    queryFn: ({ signal }) => listPeople(q, signal),
    placeholderData: keepPreviousData,
  });

export const usePeople = (q: PeopleQuery) => useQuery(peopleQueryOptions(q));
