import { z } from 'zod';

export const OutboxMessage = z.object({
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  sentAt: z.string(),
});
export type OutboxMessage = z.infer<typeof OutboxMessage>;

export const OutboxResponse = z.object({ messages: z.array(OutboxMessage) });
export type OutboxResponse = z.infer<typeof OutboxResponse>;

export const OutboxQuery = z.object({ to: z.string().trim().toLowerCase().max(254).optional() });
export type OutboxQuery = z.infer<typeof OutboxQuery>;
