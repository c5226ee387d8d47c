import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { measurePages } from '../../scripts/bench/bundle';

const projectDir = resolve(fileURLToPath(new URL('../..', import.meta.url)));
const clientDir = process.env.CLIENT_DIR ?? join(projectDir, 'dist', 'client');

// A size budget, not a timing: the JavaScript a visitor's first page needs before it shows,
// gzipped as a server would send it. The bench (`npm run bench -- bundle`) prints every page.
describe('the first pages stay light', () => {
  const w = measurePages(clientDir);

  it('the landing page needs at most 100 KB of gzipped JavaScript', () => {
    expect(w.landing).toBeLessThanOrEqual(100 * 1024);
  });

  it('the sign-in page shows with at most 100 KB, its form kit loading beside it', () => {
    expect(w.signInShown).not.toBeNull();
    expect(w.signInShown!).toBeLessThanOrEqual(100 * 1024);
    // the form kit (react-hook-form) is real weight, fetched after the page shows
    expect(w.signInAfter!).toBeGreaterThan(5 * 1024);
  });
});
