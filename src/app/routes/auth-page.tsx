import type { ReactNode } from 'react';

/** The narrow frame shared by sign-in, sign-up and the password pages. */
export function AuthPage({
  eyebrow,
  title,
  lead,
  children,
}: {
  eyebrow: string;
  title: string;
  lead?: ReactNode;
  children: ReactNode;
}) {
  return (
    <section className="mx-auto grid max-w-md gap-6 py-6">
      <header>
        <p className="text-caption font-bold uppercase tracking-[0.2em] text-brass-700 dark:text-brass-300">
          {eyebrow}
        </p>
        <h1 className="mt-1 text-title">{title}</h1>
        {lead ? <p className="mt-2 text-muted">{lead}</p> : null}
      </header>
      <div className="rounded-card border border-line bg-raised p-6">{children}</div>
    </section>
  );
}
