import type { Invite } from '../../../shared/schemas/studios';
import type { StudioInviteRow } from '../../db/schema';

export function presentInvite(row: StudioInviteRow): Invite {
  return {
    id: row.id,
    email: row.email,
    expiresAt: row.expiresAt.toISOString(),
    usedAt: row.usedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
  };
}
