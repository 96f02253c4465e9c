import type { ReactNode } from 'react';
import { Navigate, Outlet, useLocation, type RouteObject } from 'react-router-dom';
import type { Role } from '../../../shared/roles';
import { paths } from '../../config/paths';
import { Loading } from '../../components/loading';
import { useSession } from './api/get-me';
import { rolesInWords } from './role-labels';
import { signInPathFor } from './return-to';

/** What a guard hands the screen it redirects to (the shell shows it). */
export type NoticeState = { notice?: string };

/**
 * Shows its children (or the child routes) only to the given roles: signed out → sign-in and back
 * afterwards; another role → the overview with a message saying who the screen is for.
 */
export function RequireRole({ roles, children }: { roles: readonly Role[]; children?: ReactNode }) {
  const { user, isPending } = useSession();
  const location = useLocation();
  if (isPending) return <Loading label="Checking your sign-in…" />;
  if (!user) return <Navigate to={signInPathFor(location.pathname + location.search)} replace />;
  if (!roles.includes(user.role)) {
    const state: NoticeState = { notice: `That screen is for ${rolesInWords(roles)} only.` };
    return <Navigate to={paths.home} replace state={state} />;
  }
  return children ?? <Outlet />;
}

/** A layout route guarding `children` for `roles`: `guarded(['steward'], [{ path, lazy }])` in routes.tsx. */
export function guarded(roles: readonly Role[], children: RouteObject[]): RouteObject {
  return { element: <RequireRole roles={roles} />, children };
}
