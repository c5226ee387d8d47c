import { randomUUID } from 'node:crypto';
import { EngineError, midiToPlayed, type PlayedNote } from '../../../shared/engine';
import type { DrillSpec } from '../../../shared/schemas/drills';
import type { Db } from '../../db/client';
import { AppError } from '../../errors';
import { createTake } from './create';

export interface ImportTakeArgs {
  playerId: string;
  bytes: Uint8Array;
  spec: DrillSpec;
  /** where the first downbeat falls in the file; by default on the first note */
  offsetMs?: number;
  mode?: 'timed' | 'free';
  now?: Date;
}

/**
 * A take recorded elsewhere: the file's notes (its "Take" track, else every note), moved so the
 * first downbeat is at 0, then scored and stored like any other take. A file that is not a
 * Standard MIDI File, is cut short or holds no notes is refused with the engine's own words,
 * before anything is stored.
 */
export async function importTake(db: Db, args: ImportTakeArgs) {
  let played: PlayedNote[];
  try {
    played = midiToPlayed(args.bytes);
  } catch (err) {
    if (err instanceof EngineError) throw new AppError('bad_request', err.message, { file: [err.message] });
    throw err;
  }
  const downbeat = args.offsetMs ?? Math.min(...played.map((n) => n.timeMs));
  const shifted = played.map((n) => ({ ...n, timeMs: n.timeMs - downbeat }));
  const tempo = args.spec.tempo ?? 120;
  return createTake(db, {
    playerId: args.playerId,
    id: randomUUID(),
    spec: args.spec,
    played: shifted,
    options: { tempo, mode: args.mode ?? 'timed' },
    startedAt: args.now ?? new Date(),
    inputKind: 'file',
  });
}
