import { keepPreviousData, queryOptions, useMutation } from '@tanstack/react-query';
import { api, toSearch } from '@/lib/api-client';
import { queryClient } from '@/lib/query-client';
import type { ImportListResponse, ImportRowsResponse, ImportStatus, LineImportDto, RowOutcome } from '@shared/schemas/line-imports';

export interface ImportRowFilters {
  page: number;
  pageSize: number;
  outcome?: RowOutcome;
}

/** While the server is still reading or writing, the import is polled for its progress. */
export const isBusy = (status: ImportStatus | undefined) => status === 'previewing' || status === 'applying';
const POLL_MS = 1000;

export const lineImportQueries = {
  all: () => ['line-imports'] as const,
  /** Past imports, newest first; polled while one of them is still being read or written. */
  list: (page: number, pageSize = 10) =>
    queryOptions({
      queryKey: [...lineImportQueries.all(), 'list', { page, pageSize }],
      queryFn: () => api.get<ImportListResponse>(`/api/line-imports${toSearch({ page, pageSize })}`),
      placeholderData: keepPreviousData,
      refetchInterval: (query) => (query.state.data?.rows.some((r) => isBusy(r.status)) ? POLL_MS * 2 : false),
    }),
  details: () => [...lineImportQueries.all(), 'detail'] as const,
  detail: (id: string) =>
    queryOptions({
      queryKey: [...lineImportQueries.details(), id],
      queryFn: () => api.get<LineImportDto>(`/api/line-imports/${encodeURIComponent(id)}`),
      refetchInterval: (query) => (isBusy(query.state.data?.status) ? POLL_MS : false),
    }),
  rows: (id: string, filters: ImportRowFilters) =>
    queryOptions({
      queryKey: [...lineImportQueries.detail(id).queryKey, 'rows', filters],
      queryFn: () => api.get<ImportRowsResponse>(`/api/line-imports/${encodeURIComponent(id)}/rows${toSearch({ ...filters })}`),
      placeholderData: keepPreviousData,
    }),
};

const remember = (imp: LineImportDto) => queryClient.setQueryData(lineImportQueries.detail(imp.id).queryKey, imp);

/** Uploads a CSV file; the server answers with the import, previewed already or still previewing. */
export function useUploadImport() {
  return useMutation({
    mutationFn: (file: File) => {
      const form = new FormData();
      form.append('file', file);
      return api.upload<LineImportDto>('/api/line-imports', form);
    },
    onSuccess: remember,
  });
}

/** Writes a previewed import to the register: done at once (applied), or queued (applying, then polled). */
export function useConfirmImport(id: string) {
  return useMutation({
    mutationFn: () => api.post<LineImportDto>(`/api/line-imports/${encodeURIComponent(id)}/confirm`),
    onSuccess: remember,
    // A refusal (confirmed twice, stale) may mean the import moved on: read it again.
    onError: () => queryClient.invalidateQueries({ queryKey: lineImportQueries.detail(id).queryKey, exact: true }),
  });
}

/** Cancels an import that has not been written: its preview is dropped and nothing reaches the register. */
export function useCancelImport(id: string) {
  return useMutation({
    mutationFn: () => api.post<LineImportDto>(`/api/line-imports/${encodeURIComponent(id)}/cancellation`),
    onSuccess: (imp) => {
      remember(imp);
      void queryClient.invalidateQueries({ queryKey: [...lineImportQueries.all(), 'list'] });
    },
    onError: () => queryClient.invalidateQueries({ queryKey: lineImportQueries.detail(id).queryKey, exact: true }),
  });
}
