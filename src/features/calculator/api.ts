import { queryOptions } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { JointPicture, JointSpecInput } from '@shared/trade';

export const calcQueries = {
  all: () => ['calc'] as const,
  /**
   * The server's picture of one joint: a pure computation, so a POST that can be cached like a read.
   * The spec carries the plant settings it was computed for, so a change of them is a new key.
   */
  joint: (spec: JointSpecInput) =>
    queryOptions({
      queryKey: [...calcQueries.all(), 'joint', spec],
      queryFn: () => api.post<JointPicture>('/api/calc/joint', spec),
      staleTime: 5 * 60_000,
    }),
};
