/** GET /api/takes/:id: the same query and cache as the player's take page. */
export { useTake } from '@/lib/queries/take';
