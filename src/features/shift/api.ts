import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { api, sendWithKey } from '@/lib/api-client';
import type { JointDetailDto, ShiftDto } from '@shared/schemas/joint-steps';

// The shift tablet's reads. Their answers are kept on the tablet (src/lib/tablet-cache.ts keeps the
// `shift` and `joint-task` keys), so the shift view and the joints open without a network. They
// poll: other tablets record steps and locks, and holds end by the clock.

export const shiftQueries = {
  all: () => ['shift'] as const,
  mine: () => queryOptions({ queryKey: shiftQueries.all(), queryFn: () => api.get<ShiftDto>('/api/shift'), refetchInterval: 30_000 }),
};

export const jointTaskQueries = {
  all: () => ['joint-task'] as const,
  detail: (id: string) =>
    queryOptions({ queryKey: [...jointTaskQueries.all(), id], queryFn: () => api.get<JointDetailDto>(`/api/joint-tasks/${id}`), refetchInterval: 30_000 }),
};

/**
 * Marks a joint for redo; the answer is the joint that replaces it. Online only (the fitter goes on
 * to the new joint at once); the key is made once per form, so a second tap records nothing twice.
 */
export function useRedoJoint(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ reason, key }: { reason: string; key: string }) => sendWithKey<JointDetailDto>(`/api/joint-tasks/${id}/redo`, { reason }, key),
    onSuccess: (replacement) => queryClient.setQueryData(jointTaskQueries.detail(replacement.id).queryKey, replacement),
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: shiftQueries.all() }),
        queryClient.invalidateQueries({ queryKey: jointTaskQueries.all() }),
        queryClient.invalidateQueries({ queryKey: ['work-orders'] }),
      ]),
  });
}
