import type { Take } from '../../../shared/schemas/takes';
import type { TakeRow } from '../../db/schema/takes';

/** A take as the API shows it (the same shape for POST, GET and the history). */
export function presentTake(row: TakeRow): Take {
  return {
    id: row.id,
    playerId: row.playerId,
    assignmentId: row.assignmentId,
    spec: row.spec,
    options: row.options,
    measures:
      row.measureFrom !== null && row.measureTo !== null
        ? ([row.measureFrom, row.measureTo] as [number, number])
        : null,
    stoppedAtMs: row.stoppedAtMs,
    inputKind: row.inputKind,
    played: row.played,
    score: row.score,
    key: row.key,
    pattern: row.pattern,
    pair: row.pair,
    instrument: row.instrument,
    tempo: row.tempo,
    accuracy: row.accuracy,
    meanOffsetMs: row.meanOffsetMs,
    startedAt: row.startedAt.toISOString(),
    createdAt: row.createdAt.toISOString(),
  };
}
