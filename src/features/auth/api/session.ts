import { type QueryClient, queryOptions, useQuery } from '@tanstack/react-query';
import type { SessionResponse, User } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { sessionKeys } from '@/lib/queries/session-keys';

/** Who is signed in (null for a visitor; this route never answers 401). */
export function fetchSession(): Promise<SessionResponse> {
  return api.get<SessionResponse>('/api/auth/session');
}

export const sessionQueryOptions = queryOptions({
  queryKey: sessionKeys.session,
  queryFn: fetchSession,
  staleTime: 60_000,
});

/** The signed-in user, which drives navigation, guards and the home page. */
export function useMe(): { user: User | null; isLoading: boolean } {
  const query = useQuery(sessionQueryOptions);
  return { user: query.data?.user ?? null, isLoading: query.isPending };
}

/**
 * After the account changes (sign-in, sign-up, sign-out): forget every cached answer of the
 * previous account, but keep the session query itself, which mounted components watch.
 */
export function switchAccount(queryClient: QueryClient, user: User | null) {
  queryClient.setQueryData(sessionKeys.session, { user });
  queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.all[0] });
}
