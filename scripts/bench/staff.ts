/**
 * The engine and the staff in Chromium: a page of our own (built here with Vite from the real
 * modules) times the engine's cold start (loading its module and the first drill after the page
 * loads) and a key cycle of 12 drills notated and drawn with the staff renderer, first run and
 * median of 5 more, by part. The notation fonts are loaded before the timing (a one-off download).
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

const ENTRY = `
const SPEC = { pair: ['C', 'D'], pattern: 'scale-steps', direction: 'up-down', instrument: 'piano', tempo: 120 };
const t0 = performance.now();
const engine = await import('@shared/engine');
const t1 = performance.now();
engine.generateDrill(SPEC);
const t2 = performance.now();
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
window.__staffBench = { load: t1 - t0, first: t2 - t1, cycles };
`;

export async function run(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'sixfold-staff-bench-'));
  try {
    writeFileSync(join(dir, 'entry.js'), ENTRY);
    writeFileSync(
      join(dir, 'index.html'),
      '<!doctype html><html><body><div id="staff" style="width:1000px"></div><script type="module" src="./entry.js"></script></body></html>',
    );
    await build({
      configFile: false,
      root: dir,
      logLevel: 'warn',
      resolve: { alias: { '@shared': join(root, 'shared'), '@': join(root, 'src') } },
      build: { outDir: join(dir, 'dist'), emptyOutDir: true, target: 'es2022' },
    });
    const app = express().use(express.static(join(dir, 'dist')));
    const server = app.listen(0, '127.0.0.1');
    await new Promise<void>((r) => server.once('listening', () => r()));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const b = await openBrowser(base);
    try {
      await b.page.goto(`${base}/index.html`);
      await b.page.waitForFunction(() => (window as { __staffBench?: unknown }).__staffBench, null, {
        timeout: 60_000,
      });
      const r = (await b.page.evaluate(() => (window as { __staffBench?: unknown }).__staffBench)) as {
        load: number;
        first: number;
        cycles: { total: number; generate: number; notate: number; drawOne: number; drawAll: number; notes: number }[];
      };
      const med = (k: 'total' | 'generate' | 'notate' | 'drawOne' | 'drawAll') =>
        r.cycles
          .slice(1)
          .map((c) => c[k])
          .sort((x, y) => x - y)[2]
          .toFixed(1);
      console.log(
        `engine cold start after page load: module ${r.load.toFixed(1)} ms + first drill ${r.first.toFixed(1)} ms = ${(r.load + r.first).toFixed(1)} ms (goal < 50 ms)`,
      );
      console.log(
        `key cycle of 12 drills (${r.cycles[0].notes} notes each), median of 5 after a first run of ${r.cycles[0].total.toFixed(0)} ms: generated ${med('generate')} ms, notated ${med('notate')} ms, the first drawn on the staff ${med('drawOne')} ms, all 12 drawn one after another ${med('drawAll')} ms; generated, notated and the first drawn ${(Number(med('generate')) + Number(med('notate')) + Number(med('drawOne'))).toFixed(1)} ms (goal < 100 ms)`,
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
