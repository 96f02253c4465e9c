import { paths } from '../../config/paths';

/** The sign-in address that brings the user back to `here` (path + search) afterwards. */
export function signInPathFor(here: string): string {
  return here && here !== '/' && !here.startsWith(paths.signIn)
    ? `${paths.signIn}?next=${encodeURIComponent(here)}`
    : paths.signIn;
}

/** Where to go after signing in: only a path inside this app (no "//host", no scheme), else home. */
export function safeNext(next: string | null): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return paths.home;
  return next;
}
