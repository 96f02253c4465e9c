import { ACCOUNT_LINK_PATHS } from '../../shared/account';
import { env } from '../env';

/** The absolute address of a client page carrying a single-use token, for an e-mail. */
export function accountLink(kind: keyof typeof ACCOUNT_LINK_PATHS, token: string): string {
  const e = env();
  const base = e.APP_URL ?? `http://${e.HOST}:${e.PORT}`;
  const url = new URL(ACCOUNT_LINK_PATHS[kind], base);
  url.searchParams.set('token', token);
  return url.toString();
}
