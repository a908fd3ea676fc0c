import { queryOptions, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { tabletWrite, useTabletWrite } from '@/lib/offline-writes';
import type { Handover, LockBoxCreate, LockRemoval, LocksApply, LockoutDto, Verification } from '@shared/schemas/lockout';

/**
 * The lock board of one order. It sits under the order's key (`['work-orders', id, 'lockout']`), so
 * a write that invalidates every work-order query refreshes it too; it polls, because other people's
 * locks go on and come off on their own tablets.
 */
export const lockoutQueries = {
  orders: () => ['work-orders'] as const,
  board: (orderId: string) =>
    queryOptions({
      queryKey: [...lockoutQueries.orders(), orderId, 'lockout'] as const,
      queryFn: () => api.get<LockoutDto>(`/api/work-orders/${orderId}/lockout`),
      refetchInterval: 30_000,
    }),
};

/** Each lock event as a tablet write: its address, its body and the words the offline queue shows. */
export const lockoutWrites = {
  applyLocks: (orderId: string, body: LocksApply, number: string) =>
    tabletWrite(`/api/work-orders/${orderId}/locks`, body, `${number}: ${body.locks.length === 1 ? 'a lock' : `${body.locks.length} locks`} on`),
  setUpLockBox: (orderId: string, body: LockBoxCreate, number: string) =>
    tabletWrite(`/api/work-orders/${orderId}/lock-box`, body, `${number}: lock box ${body.label} set up`),
  verify: (orderId: string, body: Verification, number: string) =>
    tabletWrite(`/api/work-orders/${orderId}/verification`, body, `${number}: zero energy verified`),
  removeLock: (lockId: string, body: LockRemoval, words: string) =>
    tabletWrite(`/api/locks/${lockId}/removal`, body, words),
  handOver: (orderId: string, body: Handover, number: string) =>
    tabletWrite(`/api/work-orders/${orderId}/handovers`, body, `${number}: shift handover, ${body.locks.length === 1 ? 'a lock' : `${body.locks.length} locks`} taken over`),
};
export type LockoutWrite = ReturnType<(typeof lockoutWrites)[keyof typeof lockoutWrites]>;

/**
 * One lock event from this device: sent with its idempotency key, or kept on the tablet while offline
 * and sent in order when the network is back (src/lib/offline-writes.ts). The answer is the new board,
 * shown at once; the tablet writes' own refresh then reloads every work-order query, because the
 * order's state may have moved with it (isolated, ready).
 */
export function useLockoutWrite(orderId: string) {
  const queryClient = useQueryClient();
  const write = useTabletWrite<LockoutDto>();
  const send = (w: LockoutWrite, onDone?: () => void) => {
    write.mutate(w, {
      onSuccess: (board) => {
        if (board?.workOrderId === orderId) queryClient.setQueryData(lockoutQueries.board(orderId).queryKey, board);
        onDone?.();
      },
    });
  };
  return { send, isPending: write.isPending && !write.isPaused, isQueued: write.isPaused, error: write.error, reset: write.reset };
}
