import { Link } from 'react-router-dom';

/** The first page a visitor sees: what Sixfold is for, and where to begin. */
export function LandingRoute() {
  return (
    <section className="grid gap-10 md:grid-cols-[3fr_2fr] md:items-center">
      <div>
        <p className="text-caption font-bold uppercase tracking-[0.2em] text-brass-700 dark:text-brass-300">
          Practice companion
        </p>
        <h1 className="mt-2 text-display">Two triads, six notes, every key.</h1>
        <p className="mt-4 max-w-prose text-lead text-muted">
          Sixfold builds triad-pair drills for your instrument, listens to your MIDI keyboard or wind controller, and
          shows exactly which notes slipped in which key, so the next take is cleaner than the last.
        </p>
        <div className="mt-6 flex flex-wrap gap-3">
          <Link
            to="/sign-in"
            className="rounded-lg bg-ink-800 px-5 py-2.5 font-semibold text-white hover:bg-ink-700 dark:bg-brass-300 dark:text-ink-950"
          >
            Sign in
          </Link>
          <Link to="/sign-up" className="rounded-lg border border-line px-5 py-2.5 font-semibold hover:border-ink-300">
            Create an account
          </Link>
        </div>
      </div>
      <ol className="grid gap-3 rounded-card border border-line bg-raised p-6" aria-label="How a session goes">
        {[
          ['Find a pair', 'Type a chord; Sixfold lists the triad pairs whose six notes fit it.'],
          ['Drill it', 'Pick a pattern and play it through all 12 keys against the click.'],
          ['See what slipped', 'Every note is marked as you play; the key map shows where it keeps happening.'],
        ].map(([title, text], i) => (
          <li key={title} className="flex gap-3">
            <span className="flex h-8 w-8 shrink-0 items-center justify-center rounded-full bg-brass-100 font-bold text-ink-900">
              {i + 1}
            </span>
            <span>
              <span className="block font-bold">{title}</span>
              <span className="text-muted">{text}</span>
            </span>
          </li>
        ))}
      </ol>
    </section>
  );
}
