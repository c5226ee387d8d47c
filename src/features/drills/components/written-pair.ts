import { type Drill, instruments, writtenPair } from '@shared/engine';

/**
 * "D / C", with "(written B / A)" for a transposing instrument: the written pair spelled as one
 * unit by the engine, so it names the same notes the staff writes (concert F# / E on trumpet
 * reads Ab / Gb).
 */
export function pairTitle(drill: Drill): string {
  const { pair, instrument } = drill.spec;
  const concert = pair.join(' / ');
  if (instruments[instrument].transposition % 12 === 0) return concert;
  return `${concert} (written ${writtenPair([pair[0], pair[1]], instrument).join(' / ')})`;
}
