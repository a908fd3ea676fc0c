import { z } from 'zod';

export const IMPORT_KINDS = ['lines', 'isolation-points'] as const;
export type ImportKind = (typeof IMPORT_KINDS)[number];
export const IMPORT_STATUSES = ['previewing', 'previewed', 'applying', 'applied', 'failed', 'cancelled'] as const;
export type ImportStatus = (typeof IMPORT_STATUSES)[number];
export const ROW_OUTCOMES = ['new', 'changed', 'unchanged', 'rejected'] as const;
export type RowOutcome = (typeof ROW_OUTCOMES)[number];
export type ImportCounts = Record<RowOutcome, number>;

export const importRowSchema = z.object({
  rowNumber: z.number(),
  outcome: z.enum(ROW_OUTCOMES),
  key: z.string().nullable(),
  data: z.record(z.string(), z.unknown()).nullable(),
  changes: z.record(z.string(), z.object({ from: z.unknown(), to: z.unknown() })).nullable(),
  problems: z.array(z.object({ column: z.string(), message: z.string() })).nullable(),
});
export type ImportRowDto = z.infer<typeof importRowSchema>;

export const lineImportSchema = z.object({
  id: z.string(),
  kind: z.enum(IMPORT_KINDS),
  filename: z.string(),
  status: z.enum(IMPORT_STATUSES),
  totalRows: z.number(),
  counts: z.object({ new: z.number(), changed: z.number(), unchanged: z.number(), rejected: z.number() }),
  progress: z.number(),
  error: z.string().nullable(),
  /** The name of the person who uploaded the file. */
  uploadedBy: z.string(),
  createdAt: z.string(),
  appliedAt: z.string().nullable(),
  cancelledAt: z.string().nullable(),
});
export type LineImportDto = z.infer<typeof lineImportSchema>;

export const importIdParamsSchema = z.object({ id: z.string().uuid({ message: 'not an import id' }) });
export const importRowsQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(100),
  outcome: z.enum(ROW_OUTCOMES).optional(),
});
/** Past imports, newest first, a page at a time. */
export const importListQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
});
export type ImportListQuery = z.infer<typeof importListQuerySchema>;
export const importListResponseSchema = z.object({ rows: z.array(lineImportSchema), total: z.number() });
export type ImportListResponse = z.infer<typeof importListResponseSchema>;

export const importRowsResponseSchema = z.object({ rows: z.array(importRowSchema), total: z.number() });
export type ImportRowsResponse = z.infer<typeof importRowsResponseSchema>;

// The register files' columns (names, units, help) are in register-columns.ts.
