import { keepPreviousData, queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { api, toSearch } from '@/lib/api-client';
import type { WorkOrderCreate, WorkOrderDto, WorkOrderListResponse, WorkOrderUpdate } from '@shared/schemas/work-orders';
import type { IsolationPlanBody, IsolationPlanResponse } from '@shared/schemas/isolation-plans';
import type { JointTaskDto, JointTasksAdd } from '@shared/schemas/joint-tasks';
import type { ScheduleResponse, WindowPlanDto } from '@shared/schemas/work-order-plan';
import type { WorkOrderFilters } from '@/features/work-orders/filters';
import type { Fitter } from '@shared/schemas/roles';

/** Every work-order query, keys general → specific; a write invalidates `all()` (lists, orders, plans, the schedule). */
export const workOrderQueries = {
  all: () => ['work-orders'] as const,
  lists: () => [...workOrderQueries.all(), 'list'] as const,
  list: (filters: Partial<WorkOrderFilters>) =>
    queryOptions({
      queryKey: [...workOrderQueries.lists(), filters],
      queryFn: () => api.get<WorkOrderListResponse>(`/api/work-orders${toSearch(filters)}`),
      placeholderData: keepPreviousData,
    }),
  details: () => [...workOrderQueries.all(), 'detail'] as const,
  detail: (id: string) =>
    queryOptions({ queryKey: [...workOrderQueries.details(), id], queryFn: () => api.get<WorkOrderDto>(`/api/work-orders/${id}`) }),
  windowPlan: (id: string) =>
    queryOptions({ queryKey: [...workOrderQueries.details(), id, 'window-plan'], queryFn: () => api.get<WindowPlanDto>(`/api/work-orders/${id}/window-plan`) }),
  isolationPlan: (id: string) =>
    queryOptions({ queryKey: [...workOrderQueries.details(), id, 'isolation-plan'], queryFn: () => api.get<IsolationPlanResponse>(`/api/work-orders/${id}/isolation-plan`) }),
  /** Who may be given joint tasks (people holding the fitter role). */
  fitters: () => queryOptions({ queryKey: [...workOrderQueries.all(), 'fitters'], queryFn: () => api.get<Fitter[]>('/api/fitters'), staleTime: 5 * 60_000 }),
  schedule: (q: { from: string; to: string; area?: string }) =>
    queryOptions({
      queryKey: [...workOrderQueries.all(), 'schedule', q],
      queryFn: () => api.get<ScheduleResponse>(`/api/schedule${toSearch(q)}`),
      placeholderData: keepPreviousData,
    }),
};

/** A write's success: everything under `work-orders` may have changed (the order, its plan, the lists, the schedule). */
function useWrite<TArgs, TResult>(fn: (args: TArgs) => Promise<TResult>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => queryClient.invalidateQueries({ queryKey: workOrderQueries.all() }) });
}

export const useCreateOrder = () => useWrite((body: WorkOrderCreate) => api.post<WorkOrderDto>('/api/work-orders', body));
export const useUpdateOrder = (id: string) =>
  useWrite((body: WorkOrderUpdate) => api.patch<WorkOrderDto>(`/api/work-orders/${id}`, body));
export const usePlanOrder = (id: string) => useWrite((body: { lateReason?: string }) => api.post<WorkOrderDto>(`/api/work-orders/${id}/plan`, body));
export const useCancelOrder = (id: string) => useWrite((body: { reason: string }) => api.post<WorkOrderDto>(`/api/work-orders/${id}/cancellation`, body));
export const useAddJoints = (id: string) => useWrite((body: JointTasksAdd) => api.post<JointTaskDto[]>(`/api/work-orders/${id}/joint-tasks`, body));
export const useRemoveJoint = () => useWrite((taskId: string) => api.delete<null>(`/api/joint-tasks/${taskId}`));
export const useSetFitter = () =>
  useWrite(({ taskId, personId }: { taskId: string; personId: string | null }) => api.put<JointTaskDto>(`/api/joint-tasks/${taskId}/fitter`, { personId }));
export const useSetIsolationPlan = (id: string) =>
  useWrite((body: IsolationPlanBody) => api.put<IsolationPlanResponse>(`/api/work-orders/${id}/isolation-plan`, body));
