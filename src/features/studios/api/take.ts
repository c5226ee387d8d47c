import type { Take } from '@shared/schemas/takes';

/** A stored take as GET /api/takes/:id answers: the same shape and cache as the player's page. */
export type ReviewTake = Take;
export { useTake } from '@/lib/queries/take';
