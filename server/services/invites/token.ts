import { createHash, randomBytes } from 'node:crypto';

export const newInviteToken = () => randomBytes(32).toString('base64url');

/** Only this hash is stored, so a copy of the table cannot be turned into working links. */
export function hashInviteToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
