import { keepPreviousData, queryOptions, useMutation } from '@tanstack/react-query';
import { api, saveFile, toSearch } from '@/lib/api-client';
import type { LineDetailDto, LineListResponse } from '@shared/schemas/lines';
import { exportFilters, lineListPath, type LineFilters } from '@/features/lines/filters';

export const lineQueries = {
  all: () => ['lines'] as const,
  lists: () => [...lineQueries.all(), 'list'] as const,
  list: (filters: LineFilters) =>
    queryOptions({
      queryKey: [...lineQueries.lists(), filters],
      queryFn: () => api.get<LineListResponse>(lineListPath(filters)),
      // The previous page stays on screen while the next loads, so paging and sorting do not flash.
      placeholderData: keepPreviousData,
    }),
  details: () => [...lineQueries.all(), 'detail'] as const,
  detail: (lineNumber: string) =>
    queryOptions({
      queryKey: [...lineQueries.details(), lineNumber],
      queryFn: () => api.get<LineDetailDto>(`/api/lines/${encodeURIComponent(lineNumber)}`),
    }),
};

/** The CSV export of what the table currently shows (every page). */
export const lineExportHref = (filters: LineFilters) => `/api/lines/export.csv${toSearch(exportFilters(filters))}`;

/**
 * Fetches the export and hands it to the browser as a download; a refusal or failure stays in the
 * page as the mutation's error instead of arriving as a file that holds an error message.
 */
export function useExportLines() {
  return useMutation({
    mutationFn: async (filters: LineFilters) => {
      const { blob, filename } = await api.download(lineExportHref(filters));
      saveFile(blob, filename ?? 'line-register.csv');
    },
  });
}
