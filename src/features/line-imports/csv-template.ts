import type { ImportKind } from '@shared/schemas/line-imports';
import { REGISTER_COLUMNS } from '@shared/schemas/register-columns';

export const TEMPLATE_FILENAMES: Record<ImportKind, string> = { lines: 'lines-template.csv', 'isolation-points': 'isolation-points-template.csv' };

/** The template's header row: the register's columns (shared/schemas/register-columns.ts), in order. */
export const templateHeader = (kind: ImportKind) => REGISTER_COLUMNS[kind].map((c) => c.column).join(',');

/** A header-only CSV, built in the browser, as a link a planner can download and fill in. */
export const templateHref = (kind: ImportKind) => `data:text/csv;charset=utf-8,${encodeURIComponent(templateHeader(kind) + '\r\n')}`;
