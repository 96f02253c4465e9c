import { Link } from 'react-router-dom';
import { paths } from '../config/paths';

export function Component() {
  return (
    <section className="space-y-3">
      <h1 className="text-2xl font-semibold">Page not found</h1>
      <p className="text-ink-soft">There is no screen at this address.</p>
      <Link to={paths.home} className="text-accent hover:underline">
        Back to the overview
      </Link>
    </section>
  );
}
