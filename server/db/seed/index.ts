import type { Db } from '../client';

/**
 * Seeds the invented demo world (team brief SCENARIO.md) into an empty database.
 * Each part checks for itself, so a rerun adds nothing twice.
 */
export async function seedDemo(_db: Db): Promise<void> {
  // Accounts, studio, drills and history are added by their issues.
}
