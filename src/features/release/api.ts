import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { api, sendWithKey } from '@/lib/api-client';
import type { LineStatusBoardDto, PressureTestBody, PressureTestDto, ReleaseBlocker, ReleaseBody, ReleaseQueueDto } from '@shared/schemas/release';

/** GET /api/work-orders/:id/release-check (shared/schemas/release.ts has no schema of its own for it). */
export interface ReleaseCheckDto {
  ready: boolean;
  blockers: ReleaseBlocker[];
}

/** POST /api/work-orders/:id/release answers the order's state after. */
export interface ReleaseResultDto {
  id: string;
  number: string;
  state: string;
  releasedAt: string | null;
}

/** Operations' boards refresh on their own: holds run out, locks come off on the fitters' tablets. */
const BOARD_REFRESH_MS = 15_000;

/**
 * The test and the release. An order's pieces sit under its key (`['work-orders', id, …]`), so any
 * write that invalidates every work-order query refreshes them too.
 */
export const releaseQueries = {
  orders: () => ['work-orders'] as const,
  queue: () =>
    queryOptions({ queryKey: ['release-queue'] as const, queryFn: () => api.get<ReleaseQueueDto>('/api/release-queue'), refetchInterval: BOARD_REFRESH_MS }),
  lineStatus: () =>
    queryOptions({ queryKey: ['line-status'] as const, queryFn: () => api.get<LineStatusBoardDto>('/api/line-status'), refetchInterval: BOARD_REFRESH_MS }),
  check: (orderId: string) =>
    queryOptions({
      queryKey: [...releaseQueries.orders(), orderId, 'release-check'] as const,
      queryFn: () => api.get<ReleaseCheckDto>(`/api/work-orders/${orderId}/release-check`),
      refetchInterval: BOARD_REFRESH_MS,
    }),
  tests: (orderId: string) =>
    queryOptions({
      queryKey: [...releaseQueries.orders(), orderId, 'pressure-tests'] as const,
      queryFn: () => api.get<PressureTestDto[]>(`/api/work-orders/${orderId}/pressure-tests`),
    }),
  recordGaps: (orderId: string) =>
    queryOptions({
      queryKey: [...releaseQueries.orders(), orderId, 'record-gaps'] as const,
      queryFn: () => api.get<{ gaps: string[] }>(`/api/work-orders/${orderId}/record-gaps`),
    }),
};

/** A test or a release moves the order, its lines, the queue and the board: all of them reload. */
function useReleaseWrite<TArgs, TResult>(fn: (args: TArgs) => Promise<TResult>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    // Not awaited: the refetched order can unmount the form that asked, and its own onSuccess must still run.
    onSuccess: () =>
      void Promise.all([
        queryClient.invalidateQueries({ queryKey: releaseQueries.orders() }),
        queryClient.invalidateQueries({ queryKey: releaseQueries.queue().queryKey }),
        queryClient.invalidateQueries({ queryKey: releaseQueries.lineStatus().queryKey }),
      ]),
  });
}

/**
 * The witness records a test. The key is the form's: sending the same record again after a lost
 * answer records it once; the form takes a fresh key after a success.
 */
export const useRecordPressureTest = (orderId: string) =>
  useReleaseWrite(({ body, key }: { body: PressureTestBody; key: string }) =>
    sendWithKey<PressureTestDto>(`/api/work-orders/${orderId}/pressure-tests`, body, key));

export const useReleaseOrder = (orderId: string) =>
  useReleaseWrite((body: ReleaseBody) => api.post<ReleaseResultDto>(`/api/work-orders/${orderId}/release`, body));

/** The planner closes a released order whose record is complete. */
export const useCloseOrder = (orderId: string) => useReleaseWrite(() => api.post<unknown>(`/api/work-orders/${orderId}/close`));
