import type { Role } from '@shared/schemas/auth';
import { Link } from 'react-router-dom';

/** Shown when a signed-in user opens a page their role may not use. */
export function NotForRoleRoute({ role }: { role: Role }) {
  return (
    <section className="mx-auto max-w-lg py-16 text-center">
      <p className="text-caption font-bold uppercase tracking-[0.2em] text-muted">Not for your role</p>
      <h1 className="mt-2 text-title">This page is for another part of the band.</h1>
      <p className="mt-3 text-muted">You're signed in as a {role}, and this page belongs to a different role.</p>
      <Link
        to="/home"
        className="mt-6 inline-block rounded-lg bg-ink-800 px-5 py-2.5 font-semibold text-white dark:bg-brass-300 dark:text-ink-950"
      >
        Go to your home page
      </Link>
    </section>
  );
}
