import { z } from 'zod';

/** What bounds a loop: the drill's measures and its own tempo (a loop climbs toward it). */
export interface LoopLimits {
  measures: number;
  targetTempo: number;
}

/**
 * A passage to loop on the practice page: its measures and a starting tempo. The limits are
 * read when the input is checked, so one schema follows the drill as it changes.
 */
export const loopInput = (limits: () => LoopLimits) =>
  z
    .object({
      from: z.number({ error: 'Type a measure number' }).int({ error: 'Type a whole measure number' }),
      to: z.number({ error: 'Type a measure number' }).int({ error: 'Type a whole measure number' }),
      tempo: z.number({ error: 'Type a tempo in bpm' }).int({ error: 'Type a whole number of bpm' }),
    })
    .superRefine((v, ctx) => {
      const { measures, targetTempo } = limits();
      const measuresMessage = `Choose measures between 1 and ${measures}, the first no later than the last.`;
      if (v.from < 1 || v.from > measures) ctx.addIssue({ code: 'custom', path: ['from'], message: measuresMessage });
      if (v.to < 1 || v.to > measures) ctx.addIssue({ code: 'custom', path: ['to'], message: measuresMessage });
      else if (v.from > v.to) ctx.addIssue({ code: 'custom', path: ['to'], message: measuresMessage });
      if (v.tempo < 20 || v.tempo > targetTempo)
        ctx.addIssue({
          code: 'custom',
          path: ['tempo'],
          message: `Choose a tempo from 20 to the drill's ${targetTempo} bpm.`,
        });
    });
export type LoopInput = z.infer<ReturnType<typeof loopInput>>;
