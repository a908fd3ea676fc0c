import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiRequestError } from '@/lib/api-client';
import type { Me } from '@shared/schemas/roles';

export const authQueries = {
  all: () => ['auth'] as const,
  me: () =>
    queryOptions({
      queryKey: [...authQueries.all(), 'me'],
      queryFn: async (): Promise<Me | null> => {
        try {
          return await api.get<Me>('/api/me');
        } catch (err) {
          if (err instanceof ApiRequestError && err.status === 401) return null;
          throw err;
        }
      },
      staleTime: 60_000,
    }),
};

export function useMe(): Me {
  const { data } = useQuery(authQueries.me());
  if (!data) throw new Error('useMe outside a signed-in route');
  return data;
}

export async function signOut(): Promise<void> {
  const { redirectTo } = await api.post<{ redirectTo: string }>('/auth/logout');
  window.location.assign(redirectTo);
}
