import { z } from 'zod';

/**
 * Every error the API answers (4xx and 5xx): a code to branch on, a message to show, and for a
 * 400 about input, each bad field's messages by dotted path ('_' for the input as a whole).
 */
export const ErrorResponse = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.array(z.string())).optional(),
  }),
});
export type ErrorResponse = z.infer<typeof ErrorResponse>;
