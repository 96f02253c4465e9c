import { doubleCsrf } from 'csrf-csrf';
import { env } from '../env';

const DEV_SECRET = 'loadline-development-csrf-secret-not-for-production';

/**
 * Double-submit CSRF tokens (csrf-csrf). The token is bound to the session once signed in;
 * before sign-in it is bound to the anonymous visitor, so the client fetches a new token after sign-in.
 */
export const { generateCsrfToken, doubleCsrfProtection } = doubleCsrf({
  getSecret: () => `${env().SESSION_SECRET ?? DEV_SECRET}:csrf`,
  getSessionIdentifier: (req) => (req.user ? req.sessionID : 'anonymous'),
  cookieName: 'loadline.csrf',
  cookieOptions: { sameSite: 'lax', secure: env().COOKIE_SECURE ?? env().NODE_ENV === 'production', httpOnly: true, path: '/' },
  getCsrfTokenFromRequest: (req) => req.headers['x-csrf-token'],
  errorConfig: { statusCode: 403, message: 'Missing or invalid CSRF token; reload the page and try again' },
  // The public self-report submission has no session: its single-use token in the URL is the capability.
  // Exactly POST /api/self-report/:token is exempt, nothing else.
  skipCsrfProtection: (req) => req.method === 'POST' && /^\/api\/self-report\/[A-Za-z0-9_-]+$/.test(req.originalUrl.split('?')[0] ?? ''),
});
