import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { paths } from '../config/paths';

/** The error boundary of the route tree: a calm message, never a stack trace. */
export function RouteError() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : 'Something went wrong on this screen.';
  return (
    <div role="alert" className="mx-auto max-w-xl space-y-3 p-8">
      <h1 className="text-2xl font-semibold">This screen could not be shown</h1>
      <p className="text-ink-soft">{message}</p>
      <Link to={paths.home} className="text-accent hover:underline">
        Back to the overview
      </Link>
    </div>
  );
}
