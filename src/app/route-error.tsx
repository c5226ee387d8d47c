import { Component, type ErrorInfo, type ReactNode, useEffect } from 'react';
import { Link } from 'react-router-dom';

/** Set once per tab: a page chunk that failed to load gets one reload, never a loop. */
const RELOAD_KEY = 'sixfold:chunk-reload';

/** A page's code that cannot be fetched: after a deploy the old chunk names are gone. */
export function isChunkLoadError(error: unknown): boolean {
  const message = error instanceof Error ? `${error.name} ${error.message}` : String(error);
  return /dynamically imported module|Importing a module script failed|error loading dynamically|ChunkLoadError|Failed to fetch dynamically/i.test(
    message,
  );
}

/**
 * What the reader sees when a page throws while rendering or its code fails to load: plain
 * words, a reload and a way home, instead of a blank screen. A chunk that failed to load
 * reloads the page once by itself (a new deploy renamed it).
 */
export function RouteError({ error }: { error: unknown }) {
  const chunk = isChunkLoadError(error);

  useEffect(() => {
    if (!chunk) return;
    if (sessionStorage.getItem(RELOAD_KEY)) return;
    sessionStorage.setItem(RELOAD_KEY, '1');
    window.location.reload();
  }, [chunk]);

  return (
    <main className="mx-auto max-w-lg px-4 py-16 text-center" role="alert">
      <p className="text-caption font-bold uppercase tracking-[0.2em] text-muted">
        {chunk ? 'New version' : 'Something went wrong'}
      </p>
      <h1 className="mt-2 text-title">
        {chunk ? 'Sixfold was updated while this page was open.' : 'This page stopped on a wrong note.'}
      </h1>
      <p className="mt-3 text-muted">
        {chunk
          ? 'Reload to get the new version. Takes you played are kept on this device and sent when the page is back.'
          : 'Reload to try again. Takes you played are kept on this device and sent when the page is back.'}
      </p>
      <div className="mt-6 flex justify-center gap-3">
        <button
          type="button"
          onClick={() => {
            sessionStorage.removeItem(RELOAD_KEY);
            window.location.reload();
          }}
          className="rounded-lg bg-ink-800 px-5 py-2.5 font-semibold text-white dark:bg-brass-300 dark:text-ink-950"
        >
          Reload
        </button>
        <Link to="/" reloadDocument className="rounded-lg border border-current px-5 py-2.5 font-semibold">
          Go home
        </Link>
      </div>
    </main>
  );
}

/** Catches a render error or a failed page load below it and shows {@link RouteError}. */
export class RouteErrorBoundary extends Component<{ children: ReactNode }, { error: unknown }> {
  state: { error: unknown } = { error: null };

  static getDerivedStateFromError(error: unknown) {
    return { error };
  }

  componentDidCatch(error: unknown, info: ErrorInfo) {
    console.warn('[sixfold] a page failed', error, info.componentStack);
  }

  render() {
    return this.state.error ? <RouteError error={this.state.error} /> : this.props.children;
  }
}
