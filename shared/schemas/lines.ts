import { z } from 'zod';
import { noNul, repeatedList } from './query';
import { LINE_LIST_QUERY as Q, LINE_SORTS, LINE_STATUS_LABELS, LINE_STATUSES, PIPE_MATERIALS, SORT_DIRECTIONS } from './line-values';

/** The plain lists live in ./line-values.ts (no zod), for the register's first screen; offered here beside their schemas. */
export { LINE_SORTS, LINE_STATUS_LABELS, LINE_STATUSES, PIPE_MATERIALS };
export const pipeMaterialSchema = z.enum(PIPE_MATERIALS);
export type PipeMaterial = z.infer<typeof pipeMaterialSchema>;

export const lineStatusSchema = z.enum(LINE_STATUSES);
export type LineStatus = z.infer<typeof lineStatusSchema>;

export const ISOLATION_KINDS = ['valve', 'blind', 'disconnect'] as const;
export const isolationKindSchema = z.enum(ISOLATION_KINDS);
export type IsolationKind = z.infer<typeof isolationKindSchema>;
/** The positions each kind of isolation point can normally stand in. */
export const ISOLATION_POSITIONS: Record<IsolationKind, readonly string[]> = {
  valve: ['open', 'closed'],
  blind: ['installed', 'removed'],
  disconnect: ['connected', 'disconnected'],
};

export const isolationPointSchema = z.object({
  id: z.string(),
  tag: z.string(),
  kind: isolationKindSchema,
  normalPosition: z.string(),
  notes: z.string().nullable(),
});
export type IsolationPointDto = z.infer<typeof isolationPointSchema>;

export const lineSchema = z.object({
  id: z.string(),
  lineNumber: z.string(),
  area: z.string(),
  service: z.string(),
  material: pipeMaterialSchema,
  schedule: z.string().nullable(),
  sdr: z.number().nullable(),
  nominalSize: z.string(),
  designPressurePsi: z.number(),
  designTemperatureF: z.number(),
  drawingRef: z.string().nullable(),
  notes: z.string().nullable(),
  status: lineStatusSchema,
  isolationPointCount: z.number().optional(),
  /** Work orders on the line that are not yet released, closed or cancelled (list pages only). */
  openWorkOrders: z.number().optional(),
  updatedAt: z.string(),
});
export type LineDto = z.infer<typeof lineSchema>;
export const lineDetailSchema = lineSchema.extend({ isolationPoints: z.array(isolationPointSchema) });
export type LineDetailDto = z.infer<typeof lineDetailSchema>;

/**
 * Query of the register table: paging, one sort, filters and a line-number search. The register page
 * reads its address bar by the same rules without zod (src/features/lines/filters.ts, tested against this).
 */
export const lineListQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(Q.page),
  pageSize: z.coerce.number().int().min(1).max(Q.maxPageSize).default(Q.pageSize),
  sort: z.enum(LINE_SORTS).default(Q.sort),
  dir: z.enum(SORT_DIRECTIONS).default(Q.dir),
  search: noNul(z.string().trim().max(Q.maxSearch)).optional(),
  area: repeatedList(noNul(z.string().min(1).max(Q.maxArea))),
  material: repeatedList(pipeMaterialSchema),
  size: repeatedList(noNul(z.string().min(1).max(Q.maxSize))),
  status: repeatedList(lineStatusSchema),
});
export type LineListQuery = z.infer<typeof lineListQuerySchema>;

/**
 * Query of the register's CSV export: the list's sort, filters and search, no paging.
 * `withStatus=1` adds a `status` column after the import columns (the importer refuses it).
 */
export const lineExportQuerySchema = lineListQuerySchema.omit({ page: true, pageSize: true }).extend({
  withStatus: z.stringbool().default(false),
});
export type LineExportQuery = z.infer<typeof lineExportQuerySchema>;

export const lineListResponseSchema = z.object({
  rows: z.array(lineSchema),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
  facets: z.object({ areas: z.array(z.string()), sizes: z.array(z.string()) }),
});
export type LineListResponse = z.infer<typeof lineListResponseSchema>;

export const lineNumberParamsSchema = z.object({ lineNumber: z.string().min(1).max(100) });
