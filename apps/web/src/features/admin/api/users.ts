import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AdminUser } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const usersKey = [...rootKeys.admin, 'users'] as const;
export const getUsers = () => api.get<{ users: AdminUser[] }>('/api/users').then((r) => r.users);
export const usersQuery = () => queryOptions({ queryKey: usersKey, queryFn: getUsers });
export const useUsers = () => useQuery(usersQuery());
