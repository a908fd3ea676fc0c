import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { api, sendWithKey } from '@/lib/api-client';
import type { LineStatusBoardDto, PressureTestBody, PressureTestDto, ReleaseBlocker, ReleaseBody, ReleaseQueueDto } from '@shared/schemas/release';
import type { TemperatureLogDto } from '@shared/schemas/joint-steps';

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

// ---- temperature logs: a data logger's CSV read against the order's running holds, then applied

export const temperatureLogQueries = {
  list: (orderId: string) =>
    queryOptions({
      queryKey: [...releaseQueries.orders(), orderId, 'temperature-logs'] as const,
      queryFn: () => api.get<TemperatureLogDto[]>(`/api/work-orders/${orderId}/temperature-logs`),
    }),
};

/** Reads a CSV and answers the previewed log; nothing on the order changes yet, so only the list reloads. */
export function useReadTemperatureLog(orderId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => {
      const form = new FormData();
      form.append('file', file);
      return api.upload<TemperatureLogDto>(`/api/work-orders/${orderId}/temperature-logs`, form);
    },
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: temperatureLogQueries.list(orderId).queryKey }),
  });
}

/** Applies a previewed log: the holds move, so the order (and its holds card, and this list) reloads. */
export function useApplyTemperatureLog() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (logId: string) => api.post<TemperatureLogDto>(`/api/temperature-logs/${logId}/apply`),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: releaseQueries.orders() }),
  });
}
