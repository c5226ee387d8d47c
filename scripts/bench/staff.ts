/**
 * The engine and the staff in Chromium: a page of our own (built here with Vite from the real
 * modules) times the engine's cold start (loading its module and the first drill after the page
 * loads) and a key cycle of 12 drills generated, notated and drawn with the staff renderer, first
 * run and median of 5 more, in all and by part. The notation fonts are loaded before the timing
 * (a one-off download).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import express from 'express';
import { build } from 'vite';
import { openBrowser } from '../../tests/helpers/browser';

const root = fileURLToPath(new URL('../..', import.meta.url));

// The engine's cold start on a page of its own, as a page that draws drills loads it: the
// functions it uses, imported by name, in a chunk fetched after the page has loaded.
const COLD_ENTRY = `
const t0 = performance.now();
const { firstDrill } = await import('./cold-drill.js');
const t1 = performance.now();
firstDrill();
const t2 = performance.now();
const chunk = performance.getEntriesByType('resource').find((e) => e.name.includes('cold-drill'));
window.__coldBench = { load: t1 - t0, first: t2 - t1, fetched: chunk ? chunk.responseEnd - t0 : null };
`;
const COLD_DRILL = `
import { generateDrill } from '@shared/engine';
export const firstDrill = () =>
  generateDrill({ pair: ['C', 'D'], pattern: 'scale-steps', direction: 'up-down', instrument: 'piano', tempo: 120 });
`;

const ENTRY = `
const SPEC = { pair: ['C', 'D'], pattern: 'scale-steps', direction: 'up-down', instrument: 'piano', tempo: 120 };
const engine = await import('@shared/engine');
const { renderStaff, loadNotationFonts } = await import('@/components/notation/render-staff');
await loadNotationFonts();
const host = document.getElementById('staff');
async function keyCycle() {
  const s = performance.now();
  const drills = engine.inAllKeys(SPEC, 'fourths');
  const g = performance.now();
  const notations = drills.map((d) => engine.notate(d));
  const n = performance.now();
  await renderStaff(host, drills[0], notations[0], 1000);
  const one = performance.now();
  for (let i = 1; i < drills.length; i++) await renderStaff(host, drills[i], notations[i], 1000);
  const e = performance.now();
  return { total: e - s, generate: g - s, notate: n - g, drawOne: one - n, drawAll: e - n, notes: drills[0].notes.length };
}
const cycles = [];
for (let i = 0; i < 6; i++) cycles.push(await keyCycle());
window.__staffBench = { cycles };
`;

export async function run(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'sixfold-staff-bench-'));
  try {
    writeFileSync(join(dir, 'entry.js'), ENTRY);
    writeFileSync(join(dir, 'cold.js'), COLD_ENTRY);
    writeFileSync(join(dir, 'cold-drill.js'), COLD_DRILL);
    writeFileSync(
      join(dir, 'index.html'),
      '<!doctype html><html><head><link rel="icon" href="data:,"></head><body><div id="staff" style="width:1000px"></div><script type="module" src="./entry.js"></script></body></html>',
    );
    writeFileSync(
      join(dir, 'cold.html'),
      '<!doctype html><html><head><link rel="icon" href="data:,"></head><body><script type="module" src="./cold.js"></script></body></html>',
    );
    await build({
      configFile: false,
      root: dir,
      logLevel: 'warn',
      resolve: { alias: { '@shared': join(root, 'shared'), '@': join(root, 'src') } },
      build: {
        outDir: join(dir, 'dist'),
        emptyOutDir: true,
        target: 'es2022',
        rollupOptions: { input: { index: join(dir, 'index.html'), cold: join(dir, 'cold.html') } },
      },
    });
    const app = express().use(express.static(join(dir, 'dist')));
    const server = app.listen(0, '127.0.0.1');
    await new Promise<void>((r) => server.once('listening', () => r()));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const b = await openBrowser(base);
    try {
      // Seven fresh loads of the engine's page with the browser cache off; the median and the range.
      const cdp = await b.context.newCDPSession(b.page);
      await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
      const colds: { load: number; first: number; fetched: number | null }[] = [];
      for (let i = 0; i < 7; i++) {
        await b.page.goto(`${base}/cold.html?run=${i}`);
        await b.page.waitForFunction(() => (window as { __coldBench?: unknown }).__coldBench, null, {
          timeout: 60_000,
        });
        colds.push(
          await b.page.evaluate(() => (window as unknown as { __coldBench: (typeof colds)[number] }).__coldBench),
        );
      }
      await cdp.send('Network.setCacheDisabled', { cacheDisabled: false });
      const median = (xs: number[]) => [...xs].sort((x, y) => x - y)[Math.floor(xs.length / 2)];
      const totals = colds.map((c) => c.load + c.first);
      console.log(
        `engine cold start after page load (7 fresh loads, cache off): fetching, compiling and running the engine's chunk median ${median(colds.map((c) => c.load)).toFixed(1)} ms (of which fetched by ${median(colds.map((c) => c.fetched ?? 0)).toFixed(1)} ms) + first drill ${median(colds.map((c) => c.first)).toFixed(1)} ms = median ${median(totals).toFixed(1)} ms, range ${Math.min(...totals).toFixed(1)}-${Math.max(...totals).toFixed(1)} ms (goal < 50 ms)`,
      );
      await b.page.goto(`${base}/index.html`);
      await b.page.waitForFunction(() => (window as { __staffBench?: unknown }).__staffBench, null, {
        timeout: 60_000,
      });
      const r = (await b.page.evaluate(() => (window as { __staffBench?: unknown }).__staffBench)) as {
        cycles: { total: number; generate: number; notate: number; drawOne: number; drawAll: number; notes: number }[];
      };
      const med = (k: 'total' | 'generate' | 'notate' | 'drawOne' | 'drawAll') =>
        r.cycles
          .slice(1)
          .map((c) => c[k])
          .sort((x, y) => x - y)[2]
          .toFixed(1);
      console.log(
        `key cycle of 12 drills (${r.cycles[0].notes} notes each), median of 5 after a first run of ${r.cycles[0].total.toFixed(0)} ms: generated ${med('generate')} ms, notated ${med('notate')} ms, all 12 drawn on the staff one after another ${med('drawAll')} ms (the first ${med('drawOne')} ms); the whole cycle generated, notated and drawn ${med('total')} ms (goal < 100 ms), the first staff shown after ${(Number(med('generate')) + Number(med('notate')) + Number(med('drawOne'))).toFixed(1)} ms`,
      );
      if (b.errors.length > 0) console.log(`page errors: ${b.errors.join('; ')}`);
    } finally {
      await b.close();
      await new Promise<void>((r) => server.close(() => r()));
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
