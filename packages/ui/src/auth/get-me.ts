import { queryOptions, useQuery } from '@tanstack/react-query';
import type { User } from '@benchwright/contracts';
import { api, ApiRequestError } from '../index';

/** The signed-in user, or null. */
export async function getMe(): Promise<User | null> {
  try {
    return (await api<{ user: User }>('/auth/me')).user;
  } catch (err) {
    if (err instanceof ApiRequestError && err.status === 401) return null;
    throw err;
  }
}
export const meQueryOptions = () => queryOptions({ queryKey: ['auth', 'me'], queryFn: getMe, staleTime: 60_000 });
export const useMe = () => useQuery(meQueryOptions());
