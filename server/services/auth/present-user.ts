import type { User } from '../../../shared/schemas/auth';
import type { UserRow } from '../../db/schema';

/** The fields of a user that the API shows (never the hash). */
export function presentUser(row: Pick<UserRow, 'id' | 'email' | 'name' | 'role'>): User {
  return { id: row.id, email: row.email, name: row.name, role: row.role };
}
