import { Link } from 'react-router';
import { paths } from '@/config/paths';

export function NotFound() {
  return (
    <main className="mx-auto max-w-lg px-4 py-16 text-center">
      <h1 className="text-2xl font-semibold">Page not found</h1>
      <p className="mt-2 text-ink-soft">The address may be mistyped, or the page was moved.</p>
      <Link
        to={paths.home.getHref()}
        className="mt-6 inline-block font-medium text-primary underline"
      >
        Go to your studies
      </Link>
    </main>
  );
}
