// The register's plain values, without zod: its statuses and their names, its sorts, and the list
// query's defaults and bounds. The register page reads them on the first screen, where the schema
// library would cost its download and start-up; the schemas (./lines.ts) are built from them, so the
// page and the API cannot drift apart. (Only PIPE_MATERIALS comes from shared/trade: the build treats
// shared/trade as free of side effects, see vite.config.ts, so the rest of the trade stays out.)

import { PIPE_MATERIALS } from '@shared/trade';

/** The trade's one list of pipe materials (shared/trade/pipe-materials.ts), offered here beside the statuses. */
export { PIPE_MATERIALS };

export const LINE_STATUSES = ['in-service', 'out-of-service', 'locked-out'] as const;
export const LINE_STATUS_LABELS: Record<(typeof LINE_STATUSES)[number], string> = {
  'in-service': 'In service',
  'out-of-service': 'Out of service',
  'locked-out': 'Locked out',
};

export const LINE_SORTS = ['lineNumber', 'area', 'service', 'material', 'nominalSize', 'designPressurePsi', 'status', 'updatedAt'] as const;
export const SORT_DIRECTIONS = ['asc', 'desc'] as const;

/** The register list query's defaults and limits (lengths in UTF-16 units, as zod counts them). */
export const LINE_LIST_QUERY = {
  page: 1,
  pageSize: 50,
  maxPageSize: 200,
  sort: 'lineNumber',
  dir: 'asc',
  maxSearch: 100,
  maxArea: 200,
  maxSize: 50,
} as const satisfies { sort: (typeof LINE_SORTS)[number]; dir: (typeof SORT_DIRECTIONS)[number] } & Record<string, unknown>;
