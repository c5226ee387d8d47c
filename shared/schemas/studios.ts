import { z } from 'zod';

export const StudioMember = z.object({ id: z.string(), name: z.string(), joinedAt: z.string() });
export type StudioMember = z.infer<typeof StudioMember>;

export const Studio = z.object({
  id: z.string(),
  name: z.string(),
  teacher: z.object({ id: z.string(), name: z.string() }),
  playerCount: z.number().int(),
  /** listed for the studio's teacher and admins only */
  members: z.array(StudioMember).optional(),
});
export type Studio = z.infer<typeof Studio>;

export const StudioResponse = z.object({ studio: Studio });
export type StudioResponse = z.infer<typeof StudioResponse>;

export const StudiosResponse = z.object({ studios: z.array(Studio) });
export type StudiosResponse = z.infer<typeof StudiosResponse>;

export const StudioParams = z.object({ id: z.string() });
export type StudioParams = z.infer<typeof StudioParams>;
