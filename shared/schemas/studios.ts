import { z } from 'zod';
import { DisplayName, Email, NewPassword } from './auth';

export const StudioMember = z.object({ id: z.string(), name: z.string(), joinedAt: z.string() });
export type StudioMember = z.infer<typeof StudioMember>;

/** What the viewer is in a studio: its teacher, one of its players, or an admin looking in. */
export const StudioRole = z.enum(['teacher', 'player', 'admin']);
export type StudioRole = z.infer<typeof StudioRole>;

export const Person = z.object({ id: z.string(), name: z.string(), email: z.string() });
export type Person = z.infer<typeof Person>;

export const Studio = z.object({
  id: z.string(),
  name: z.string(),
  role: StudioRole,
  teacher: Person,
  playerCount: z.number().int(),
  /** listed for the studio's teacher and admins only */
  members: z.array(StudioMember).optional(),
});
export type Studio = z.infer<typeof Studio>;

/** `GET /api/studios/:id`: the players in full for the teacher and admins, only oneself for a player. */
export const StudioDetail = Studio.extend({ players: z.array(Person) });
export type StudioDetail = z.infer<typeof StudioDetail>;

export const StudioResponse = z.object({ studio: StudioDetail });
export type StudioResponse = z.infer<typeof StudioResponse>;

export const StudiosResponse = z.object({ studios: z.array(Studio) });
export type StudiosResponse = z.infer<typeof StudiosResponse>;

export const StudioParams = z.object({ id: z.string().max(64) });
export type StudioParams = z.infer<typeof StudioParams>;

export const StudioPlayerParams = z.object({
  id: z.uuid({ error: 'That is not a studio id' }),
  playerId: z.uuid({ error: 'That is not a player id' }),
});
export type StudioPlayerParams = z.infer<typeof StudioPlayerParams>;

export const StudioName = z
  .string({ error: 'Name the studio' })
  .trim()
  .min(1, { error: 'Name the studio' })
  .max(80, { error: 'Keep the name under 80 characters' });

export const CreateStudioInput = z.object({ name: StudioName });
export type CreateStudioInput = z.infer<typeof CreateStudioInput>;

/* ---------- invites ---------- */

export const INVITE_DAYS = 7;

export const CreateInviteInput = z.object({ email: Email });
export type CreateInviteInput = z.infer<typeof CreateInviteInput>;

export const Invite = z.object({
  id: z.string(),
  email: z.string(),
  expiresAt: z.string(),
  usedAt: z.string().nullable(),
  createdAt: z.string(),
});
export type Invite = z.infer<typeof Invite>;

export const InviteResponse = z.object({ invite: Invite });
export type InviteResponse = z.infer<typeof InviteResponse>;
export const InvitesResponse = z.object({ invites: z.array(Invite) });
export type InvitesResponse = z.infer<typeof InvitesResponse>;

export const InviteToken = z
  .string({ error: 'The link is missing its token' })
  .min(20, { error: 'The link is incomplete; open it from the e-mail again' })
  .max(200, { error: 'The link is not valid' });

export const InviteTokenParams = z.object({ token: InviteToken });

/** `GET /api/invites/:token`: what the invite page shows before anyone signs in. */
export const InvitePreview = z.object({
  studio: z.object({ id: z.string(), name: z.string() }),
  teacher: z.object({ name: z.string() }),
  email: z.string(),
  /** an account already uses the invited address: sign in and accept, rather than sign up */
  accountExists: z.boolean(),
  expiresAt: z.string(),
});
export type InvitePreview = z.infer<typeof InvitePreview>;
export const InvitePreviewResponse = z.object({ invite: InvitePreview });
export type InvitePreviewResponse = z.infer<typeof InvitePreviewResponse>;

/** `POST /api/invites/:token/accept`: the studio the signed-in player has joined. */
export const AcceptInviteResponse = z.object({ studio: z.object({ studioId: z.string(), studioName: z.string() }) });
export type AcceptInviteResponse = z.infer<typeof AcceptInviteResponse>;

/** Sign up through an invite: the address is the invite's, the role is player. */
export const InviteSignUpInput = z.object({ name: DisplayName, password: NewPassword });
export type InviteSignUpInput = z.infer<typeof InviteSignUpInput>;
