import { useRef } from 'react';
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { User } from '@splitcase/contracts';
import { api, ApiError } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const meKey = [...rootKeys.auth, 'me'] as const;

/** The signed-in user, or null when signed out. */
export async function getMe(): Promise<User | null> {
  try {
    return (await api.get<{ user: User }>('/api/auth/me', { quiet401: true })).user;
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}

export const meQuery = () => queryOptions({ queryKey: meKey, queryFn: getMe, staleTime: 60_000 });
export const useMe = () => useQuery(meQuery());

/**
 * The signed-in user, for what renders under RequireAuth. Signing out clears the cache before the
 * router has left the page, so the page's last renders see no user: they keep the one they had
 * instead of failing on null (RequireAuth then sends the browser to sign-in).
 */
export function useSignedInUser(): User {
  const me = useMe().data;
  const last = useRef<User | null>(null);
  if (me) last.current = me;
  if (!last.current) throw new Error('useSignedInUser is for pages under RequireAuth.');
  return last.current;
}
