import { z } from 'zod';
import { EngineError } from '../engine/errors';
import { pairsForChord } from '../engine/theory/fit-finder';

/**
 * The fit finder's question: one chord symbol that the engine can read. The engine's own
 * reason is the message when it cannot.
 */
export const FindPairsInput = z.object({
  chord: z
    .string({ error: 'Type a chord symbol first, such as D7.' })
    .trim()
    .min(1, { error: 'Type a chord symbol first, such as D7.' })
    .max(24, { error: 'That chord symbol is too long' })
    .superRefine((chord, ctx) => {
      // an empty or overlong symbol already has its message
      if (chord === '' || chord.length > 24) return;
      try {
        pairsForChord(chord);
      } catch (err) {
        if (!(err instanceof EngineError)) throw err;
        ctx.addIssue({ code: 'custom', message: err.message });
      }
    }),
});
export type FindPairsInput = z.infer<typeof FindPairsInput>;
