import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';

/**
 * What each page makes the browser download: the JavaScript of the entry plus the page's own
 * chunk and everything those import statically, gzipped (level 9, as a server would send it
 * pre-compressed). The first page a visitor meets is the landing page.
 */
interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
}

const projectDir = resolve(fileURLToPath(new URL('../..', import.meta.url)));

export interface PageWeights {
  /** the landing page: the entry and what it imports, gzipped bytes */
  landing: number;
  /** the sign-in page before it shows (its form kit follows) and the form kit itself */
  signInShown: number | null;
  signInAfter: number | null;
  /** each route's own chunks beyond the entry, and the whole page */
  pages: Array<{ name: string; own: number; whole: number }>;
}

/** Adds up, from a client build's manifest, the gzipped JavaScript each page loads. */
export function measurePages(outDir: string): PageWeights {
  const manifestPath = join(outDir, '.vite', 'manifest.json');
  if (!existsSync(manifestPath)) throw new Error('the build wrote no manifest');
  const manifest = JSON.parse(readFileSync(manifestPath, 'utf8')) as Record<string, ManifestChunk>;
  const gz = new Map<string, number>();
  const sizeOf = (file: string) => {
    let n = gz.get(file);
    if (n === undefined) {
      n = gzipSync(readFileSync(join(outDir, file)), { level: 9 }).length;
      gz.set(file, n);
    }
    return n;
  };
  const closure = (keys: string[], seen = new Set<string>()) => {
    for (const key of keys) {
      if (seen.has(key)) continue;
      seen.add(key);
      closure(manifest[key]?.imports ?? [], seen);
    }
    return seen;
  };
  const entryKey = Object.keys(manifest).find((k) => manifest[k].isEntry);
  if (!entryKey) throw new Error('no entry in the manifest');
  const entry = closure([entryKey]);
  const total = (keys: Iterable<string>) => [...keys].reduce((sum, k) => sum + sizeOf(manifest[k].file), 0);
  const beyondEntry = (keys: Set<string>) => [...keys].filter((k) => !entry.has(k));
  const landing = total(entry);
  const pages: PageWeights['pages'] = [];
  for (const [key, chunk] of Object.entries(manifest)) {
    if (!key.startsWith('src/app/routes/') || chunk.isEntry) continue;
    const own = total(beyondEntry(closure([key])));
    pages.push({ name: key.replace('src/app/routes/', '').replace('.tsx', ''), own, whole: landing + own });
  }
  pages.sort((a, b) => a.name.localeCompare(b.name));
  // The sign-in page paints its form's outline first and fetches the form kit beside it.
  const signInKey = 'src/app/routes/sign-in.tsx';
  let signInShown: number | null = null;
  let signInAfter: number | null = null;
  if (manifest[signInKey]) {
    const shown = closure([signInKey]);
    signInShown = landing + total(beyondEntry(shown));
    const after = closure(manifest[signInKey].dynamicImports ?? []);
    signInAfter = total([...after].filter((k) => !shown.has(k) && !entry.has(k)));
  }
  return { landing, signInShown, signInAfter, pages };
}

export async function run() {
  const outDir = join(projectDir, 'dist', 'bench-client');
  const built = spawnSync(
    process.execPath,
    ['node_modules/vite/bin/vite.js', 'build', '--outDir', outDir, '--emptyOutDir', '--logLevel', 'warn'],
    { cwd: projectDir, stdio: 'inherit' },
  );
  if (built.status !== 0) throw new Error('the client build failed');
  const w = measurePages(outDir);
  const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;
  console.log(`first page (landing): ${kb(w.landing)} gzip JavaScript (goal <= 100 KB)`);
  if (w.signInShown !== null)
    console.log(
      `sign-in page: ${kb(w.signInShown)} gzip JavaScript before it shows (goal <= 100 KB); its form kit follows (${kb(w.signInAfter ?? 0)})`,
    );
  console.log('page               own chunks   whole page');
  for (const { name, own, whole } of w.pages)
    console.log(`${name.padEnd(18)} ${kb(own).padStart(10)}   ${kb(whole).padStart(10)}`);
}
