import { queryOptions, useQuery } from '@tanstack/react-query';
import type { User } from '@splitcase/contracts';
import { api, ApiError } from '@/lib/api-client';

export const meKey = ['auth', 'me'] as const;

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
