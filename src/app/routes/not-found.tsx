import { Link } from 'react-router-dom';

export function NotFoundRoute() {
  return (
    <section className="mx-auto max-w-lg py-16 text-center">
      <p className="text-caption font-bold uppercase tracking-[0.2em] text-muted">Page not found</p>
      <h1 className="mt-2 text-title">That measure isn't in the chart.</h1>
      <p className="mt-3 text-muted">The address may be mistyped, or the page has moved.</p>
      <Link
        to="/"
        className="mt-6 inline-block rounded-lg bg-ink-800 px-5 py-2.5 font-semibold text-white dark:bg-brass-300 dark:text-ink-950"
      >
        Back to the start
      </Link>
    </section>
  );
}
