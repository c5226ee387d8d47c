/**
 * Progression figures: a 12-bar blues through the key cycle with every preset (84 drills over
 * changes), the goal being under 50 ms in all; and the fit finder's first answers in a fresh
 * process (fit-finder-cold.ts), what the drills page waits for on its first key cycle.
 */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { type ChordChange, type PatternId, inAllKeys } from '../../shared/engine';
import { presets } from '../../shared/engine/patterns';

const PRESETS = Object.keys(presets) as PatternId[];
const BLUES: ChordChange[] = ['F7', 'Bb7', 'F7', 'F7', 'Bb7', 'Bb7', 'F7', 'D7', 'Gm7', 'C7', 'F7', 'C7'].map(
  (chord) => ({ chord, beats: 4 }),
);

function everyBluesCycle(): { drills: number; notes: number } {
  let drills = 0;
  let notes = 0;
  for (const pattern of PRESETS) {
    for (const d of inAllKeys({ pattern, direction: 'up', changes: BLUES }, 'fourths')) {
      drills++;
      notes += d.notes.length;
    }
  }
  return { drills, notes };
}

/** CPU time of this process in ms: steadier than wall-clock when other work shares the cores. */
function cpuMs(fn: () => unknown): number {
  const c0 = process.cpuUsage();
  fn();
  const c = process.cpuUsage(c0);
  return (c.user + c.system) / 1000;
}

function time<T>(fn: () => T): [T, number] {
  const t0 = performance.now();
  const out = fn();
  return [out, performance.now() - t0];
}

const COLD_RUNS = 9;

/** Medians over fresh processes of the fit finder's first answer, and of the other 23 first answers together. */
function fitFinderCold(): { first: number; rest: number; slowest: number } | null {
  const script = fileURLToPath(new URL('./fit-finder-cold.ts', import.meta.url));
  const runs: number[][] = [];
  for (let i = 0; i < COLD_RUNS; i++) {
    const child = spawnSync(process.execPath, ['--import', 'tsx', script], { encoding: 'utf8' });
    if (child.status !== 0) return null;
    runs.push(JSON.parse(child.stdout.trim().split('\n').pop() ?? '[]') as number[]);
  }
  const median = (xs: number[]) => [...xs].sort((x, y) => x - y)[Math.floor(xs.length / 2)];
  const sum = (xs: number[]) => xs.reduce((x, y) => x + y, 0);
  return {
    first: median(runs.map((r) => r[0])),
    rest: median(runs.map((r) => sum(r.slice(1)))),
    slowest: Math.max(...runs[0].slice(1).map((_, i) => median(runs.map((r) => r[i + 1])))),
  };
}

export async function run(): Promise<void> {
  const [, cold] = time(everyBluesCycle);
  const runs: number[] = [];
  let last = { drills: 0, notes: 0 };
  for (let i = 0; i < 7; i++) {
    const [r, ms] = time(everyBluesCycle);
    runs.push(ms);
    last = r;
  }
  runs.sort((x, y) => x - y);
  const median = runs[Math.floor(runs.length / 2)];
  console.log(
    `12-bar blues x 12 keys x ${PRESETS.length} presets: ${last.drills} drills, ${last.notes} notes (inAllKeys, fourths)`,
  );
  console.log(`  first run (cold caches, the fit finder's first answers for 24 chords): ${cold.toFixed(1)} ms`);
  console.log(`  median of 7 warm runs: ${median.toFixed(1)} ms total (goal: under 50 ms)`);
  const cpu: number[] = [];
  for (let i = 0; i < 7; i++) cpu.push(cpuMs(everyBluesCycle));
  cpu.sort((x, y) => x - y);
  console.log(`  median CPU time of 7 runs: ${cpu[3].toFixed(1)} ms (includes garbage collection on other threads)`);
  const firsts = fitFinderCold();
  if (!firsts) {
    console.log('  pairsForChord cold start: the child process failed');
    return;
  }
  console.log(
    `pairsForChord cold start, median of ${COLD_RUNS} fresh processes (F7 first, then the other 11 dominant sevenths and 12 minor sevenths):`,
  );
  console.log(`  first answer: ${firsts.first.toFixed(1)} ms (reads every pair once)`);
  console.log(
    `  the other 23 first answers: ${firsts.rest.toFixed(1)} ms together, the slowest ${firsts.slowest.toFixed(1)} ms`,
  );
}

const invokedDirectly = typeof process !== 'undefined' && process.argv[1]?.endsWith('changes.ts');
if (invokedDirectly) await run();
