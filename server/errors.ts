import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';

/** An error with an HTTP status; the message is safe to show to the caller. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly issues?: unknown[],
  ) {
    super(message);
  }
}
export class BadRequestError extends HttpError {
  constructor(message = 'Malformed request') {
    super(400, message);
  }
}
export class UnauthorizedError extends HttpError {
  constructor(message = 'Sign in to continue') {
    super(401, message);
  }
}
export class ForbiddenError extends HttpError {
  constructor(message = 'You do not have access to this') {
    super(403, message);
  }
}
export class NotFoundError extends HttpError {
  constructor(message = 'Not found') {
    super(404, message);
  }
}
export class ConflictError extends HttpError {
  constructor(message: string) {
    super(409, message);
  }
}
export class ValidationError extends HttpError {
  constructor(message: string, issues: unknown[] = []) {
    super(422, message, issues);
  }
}

type Logger = (message: string) => void;

function statusOf(err: unknown): number | undefined {
  const s = (err as { status?: unknown; statusCode?: unknown })?.status ?? (err as { statusCode?: unknown })?.statusCode;
  return typeof s === 'number' && s >= 400 && s < 600 ? s : undefined;
}

/** PostgreSQL being unreachable (restart, outage) is a 503, not a 500. */
function isDatabaseDown(err: unknown): boolean {
  const cause = (err as { cause?: unknown })?.cause;
  if (cause && cause !== err && isDatabaseDown(cause)) return true;
  const code = (err as { code?: unknown })?.code;
  const msg = err instanceof Error ? err.message : '';
  return (
    code === 'ECONNREFUSED' ||
    code === 'ECONNRESET' ||
    code === '57P02' || // crash_shutdown
    code === '57P01' || // admin_shutdown
    code === '57P03' || // cannot_connect_now
    /Connection terminated|timeout exceeded when trying to connect/i.test(msg)
  );
}

/** The one error middleware: every error leaves as `{ error: { message, issues? } }`. */
export function errorHandler(log: Logger): ErrorRequestHandler {
  return (err, _req, res, _next) => {
    let status = 500;
    let message = 'Something went wrong on our side; the error was logged';
    let issues: unknown[] | undefined;
    if (err instanceof HttpError) {
      ({ status, message, issues } = err);
    } else if (err instanceof ZodError) {
      status = 422;
      message = 'Some fields are not valid';
      issues = err.issues.map((i) => ({ path: i.path, message: i.message, code: i.code }));
    } else if ((err as { type?: string })?.type === 'entity.too.large' || statusOf(err) === 413) {
      status = 413;
      message = 'The request is too large';
    } else if ((err as { type?: string })?.type === 'entity.parse.failed' || err instanceof SyntaxError) {
      status = 400;
      message = 'The request body is not valid JSON';
    } else if (isDatabaseDown(err)) {
      status = 503;
      message = 'The registry database is unavailable; try again in a moment';
    } else if (statusOf(err) && statusOf(err)! < 500) {
      status = statusOf(err)!;
      message = err instanceof Error ? err.message : message;
    }
    if (status >= 500) log(`error ${status}: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
    res.status(status).json({ error: issues ? { message, issues } : { message } });
  };
}
