// The auth feature's public surface for other screens.
export { RequireRole, guarded, type NoticeState } from './require-role';
export { useSession, meQueryOptions, getMe } from './api/get-me';
export { useSignIn } from './api/sign-in';
export { useSignOut } from './api/sign-out';
export { visibleNavigation } from './nav-access';
export { ROLE_LABELS, rolesInWords } from './role-labels';
export { signInPathFor, safeNext } from './return-to';
export { UserMenu } from './components/user-menu';
