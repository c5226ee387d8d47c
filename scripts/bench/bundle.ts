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

export async function run() {
  const outDir = join(projectDir, 'dist', 'bench-client');
  const built = spawnSync(
    process.execPath,
    ['node_modules/vite/bin/vite.js', 'build', '--outDir', outDir, '--emptyOutDir', '--logLevel', 'warn'],
    { cwd: projectDir, stdio: 'inherit' },
  );
  if (built.status !== 0) throw new Error('the client build failed');
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
  const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;
  const total = (keys: Set<string>) => [...keys].reduce((sum, k) => sum + sizeOf(manifest[k].file), 0);
  const entryBytes = total(entry);
  console.log(`first page (landing): ${kb(entryBytes)} gzip JavaScript (goal <= 100 KB)`);
  const rows: Array<[string, number, number]> = [];
  for (const [key, chunk] of Object.entries(manifest)) {
    if (!key.startsWith('src/app/routes/') || chunk.isEntry) continue;
    const own = closure([key]);
    const extra = new Set([...own].filter((k) => !entry.has(k)));
    rows.push([key.replace('src/app/routes/', '').replace('.tsx', ''), total(extra), entryBytes + total(extra)]);
  }
  rows.sort((a, b) => a[0].localeCompare(b[0]));
  // The sign-in page paints its form's outline first and fetches the form kit beside it.
  const signIn = manifest['src/app/routes/sign-in.tsx'];
  if (signIn) {
    const shown = closure(['src/app/routes/sign-in.tsx'], new Set(entry));
    const after = new Set(
      [...closure(signIn.dynamicImports ?? [], new Set())].filter((k) => !shown.has(k) && !entry.has(k)),
    );
    const shownBytes = entryBytes + total(new Set([...shown].filter((k) => !entry.has(k))));
    console.log(
      `sign-in page: ${kb(shownBytes)} gzip JavaScript before it shows (goal <= 100 KB); its form kit follows (${kb(total(after))})`,
    );
  }
  console.log('page               own chunks   whole page');
  for (const [name, own, whole] of rows)
    console.log(`${name.padEnd(18)} ${kb(own).padStart(10)}   ${kb(whole).padStart(10)}`);
}
