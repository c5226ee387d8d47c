export {};
/**
 * `npm run bench`: prints figures for the README's performance table. Never a test:
 * wall-clock numbers depend on the machine. Each section lives in its own file.
 */
const sections: Array<[string, () => Promise<{ run: () => Promise<void> }>]> = [
  ['engine', () => import('./engine')],
  ['changes', () => import('./changes')],
  ['scoring', () => import('./scoring')],
  ['maps', () => import('./maps')],
  ['takes-load', () => import('./takes-load')],
  ['live-marks', () => import('./live-marks')],
  ['staff', () => import('./staff')],
  ['listening', () => import('./listening')],
  ['bundle', () => import('./bundle')],
];

const only = process.argv.slice(2);
for (const [name, load] of sections) {
  if (only.length > 0 && !only.includes(name)) continue;
  let mod: { run: () => Promise<void> };
  try {
    mod = await load();
  } catch (err) {
    console.log(`[${name}] not available yet: ${(err as Error).message}`);
    continue;
  }
  console.log(`\n== ${name} ==`);
  await mod.run();
}
