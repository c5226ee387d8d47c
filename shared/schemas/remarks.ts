import { z } from 'zod';

export const CreateRemarkInput = z.object({
  body: z
    .string({ error: 'Write the remark' })
    .trim()
    .min(1, { error: 'Write the remark' })
    .max(2000, { error: 'Keep it under 2000 characters' }),
  /** pin it to one expected note of the take (0-based, as in the score's results) */
  noteIndex: z.number().int().min(0).nullable().optional(),
  /** answer this remark (a player answers their teacher's) */
  parentId: z.uuid().nullable().optional(),
});
export type CreateRemarkInput = z.infer<typeof CreateRemarkInput>;

export const Remark = z.object({
  id: z.string(),
  takeId: z.string(),
  studioId: z.string(),
  parentId: z.string().nullable(),
  noteIndex: z.number().nullable(),
  body: z.string(),
  author: z.object({ id: z.string(), name: z.string(), role: z.string() }),
  createdAt: z.string(),
});
export type Remark = z.infer<typeof Remark>;

export const RemarkResponse = z.object({ remark: Remark });
export type RemarkResponse = z.infer<typeof RemarkResponse>;
export const RemarksResponse = z.object({ remarks: z.array(Remark) });
export type RemarksResponse = z.infer<typeof RemarksResponse>;

export const TakeRemarksParams = z.object({ takeId: z.uuid({ error: 'That is not a take id' }) });

export const Notification = z.object({
  id: z.string(),
  kind: z.string(),
  text: z.string(),
  link: z.string(),
  read: z.boolean(),
  createdAt: z.string(),
});
export type Notification = z.infer<typeof Notification>;

export const NotificationsResponse = z.object({ notifications: z.array(Notification), unread: z.number().int() });
export type NotificationsResponse = z.infer<typeof NotificationsResponse>;
