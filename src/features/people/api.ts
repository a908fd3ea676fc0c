import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { authQueries } from '@/lib/auth';
import type { Person, Role } from '@shared/schemas/roles';

export const peopleQueries = {
  all: () => ['people'] as const,
  list: () =>
    queryOptions({
      queryKey: [...peopleQueries.all(), 'list'],
      queryFn: () => api.get<Person[]>('/api/people'),
    }),
};

/** Saves the roles an admin wants a person to hold; the server keeps them as grants and withdrawals. */
export function useSetRoles() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, roles }: { id: string; roles: Role[] }) => api.put<Person>(`/api/people/${id}/roles`, { roles }),
    onSuccess: async (saved) => {
      const me = queryClient.getQueryData(authQueries.me().queryKey);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: peopleQueries.all() }),
        me?.id === saved.id ? queryClient.invalidateQueries({ queryKey: authQueries.me().queryKey }) : null,
      ]);
    },
  });
}
