import { useMutation, useQueryClient } from '@tanstack/react-query';
import { LoginInputSchema, MeResponseSchema, type LoginInput } from '../../../../shared/auth';
import { apiFetch, resetCsrfToken } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { getMe } from './get-me';

export async function signIn(input: LoginInput) {
  const res = await apiFetch('/api/auth/login', MeResponseSchema, {
    method: 'POST',
    body: LoginInputSchema.parse(input),
  });
  // the CSRF token is bound to the session, which is new now
  resetCsrfToken();
  return res;
}

/** Signs in, then reloads the session (with its flags) and drops data cached for anyone else. */
export function useSignIn() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    meta: { authFlow: true },
    onSuccess: async () => {
      client.removeQueries({ predicate: (q) => q.queryKey[0] !== 'health' });
      client.setQueryData(queryKeys.auth.me(), await getMe());
    },
  });
}
