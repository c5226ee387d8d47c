/**
 * Engine figures: time to generate every preset in all 12 keys, every direction, for every
 * instrument (the key cycles a teacher can assign), plus a key cycle through the public API.
 */
import {
  type Direction,
  type InstrumentId,
  type PatternId,
  generateDrill,
  inAllKeys,
  instruments,
} from '../../shared/engine';
import { presets } from '../../shared/engine/patterns';

const PRESETS = Object.keys(presets) as PatternId[];
const DIRECTIONS: Direction[] = ['up', 'down', 'up-down'];
const INSTRUMENTS = Object.keys(instruments) as InstrumentId[];
const ROOTS = ['C', 'Db', 'D', 'Eb', 'E', 'F', 'F#', 'G', 'Ab', 'A', 'Bb', 'B'];
const UPPER = ['D', 'Eb', 'E', 'F', 'F#', 'G', 'Ab', 'A', 'Bb', 'B', 'C', 'Db'];

function everyDrill(): { drills: number; notes: number } {
  let drills = 0;
  let notes = 0;
  for (const pattern of PRESETS) {
    for (const direction of DIRECTIONS) {
      for (const instrument of INSTRUMENTS) {
        for (let k = 0; k < 12; k++) {
          const d = generateDrill({ pair: [ROOTS[k], UPPER[k]], pattern, direction, instrument });
          drills++;
          notes += d.notes.length;
        }
      }
    }
  }
  return { drills, notes };
}

function everyKeyCycle(): number {
  let drills = 0;
  for (const pattern of PRESETS) {
    for (const direction of DIRECTIONS) {
      for (const instrument of INSTRUMENTS) {
        drills += inAllKeys({ pair: ['C', 'D'], pattern, direction, instrument }, 'fourths').length;
      }
    }
  }
  return drills;
}

function time<T>(fn: () => T): [T, number] {
  const t0 = performance.now();
  const out = fn();
  return [out, performance.now() - t0];
}

/** CPU time of this process in ms: steadier than wall-clock when other work shares the cores. */
function cpuMs<T>(fn: () => T): number {
  const c0 = process.cpuUsage();
  fn();
  const c = process.cpuUsage(c0);
  return (c.user + c.system) / 1000;
}

export async function run(): Promise<void> {
  const [, cold] = time(everyDrill);
  const runs: number[] = [];
  let last = { drills: 0, notes: 0 };
  for (let i = 0; i < 5; i++) {
    const [r, ms] = time(everyDrill);
    runs.push(ms);
    last = r;
  }
  runs.sort((x, y) => x - y);
  const median = runs[Math.floor(runs.length / 2)];
  console.log(
    `generateDrill: ${PRESETS.length} presets x 12 keys x ${DIRECTIONS.length} directions x ${INSTRUMENTS.length} instruments = ${last.drills} drills, ${last.notes} notes`,
  );
  console.log(`  first run (cold caches): ${cold.toFixed(1)} ms`);
  console.log(
    `  median of 5 warm runs:   ${median.toFixed(1)} ms total, ${((median * 1000) / last.drills).toFixed(1)} us per drill (goal: under 50 ms total)`,
  );
  const cpu: number[] = [];
  for (let i = 0; i < 5; i++) cpu.push(cpuMs(everyDrill));
  cpu.sort((x, y) => x - y);
  console.log(`  median CPU time of 5 runs: ${cpu[2].toFixed(1)} ms (includes garbage collection on other threads)`);
  const [cycles, cycleMs] = time(everyKeyCycle);
  console.log(
    `inAllKeys (fourths) for every preset, direction and instrument: ${cycles} drills in ${cycleMs.toFixed(1)} ms`,
  );
}

const invokedDirectly = typeof process !== 'undefined' && process.argv[1]?.endsWith('engine.ts');
if (invokedDirectly) await run();
