// Set-based SQL of the register import: reading the register for a preview, writing the preview
// rows by COPY, upserting a confirmed import into lines / isolation_points, and the sweep's search
// for imports left in progress. Single import rows (line_imports) go through the LineImport model.

import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { CHUNK_ROWS, copyIn, copyText } from '@server/db/copy';
import type { ImportKind, RowOutcome } from '@shared/schemas/line-imports';
import type { IsolationKind, PipeMaterial } from '@shared/schemas/lines';

const select = <T extends object>(sql: string, bind: unknown[], transaction?: Transaction) =>
  sequelize.query<T>(sql, { type: QueryTypes.SELECT, bind, transaction });

// ── the preview's read of the register ──────────────────────────────────────────────────────────
// Keys are joined as a set (not `= any($1)`): with the array bound, the planner sees its size and
// hash-joins a large file against the register, or probes the index for a small one.

export interface RegisterLine {
  lineNumber: string;
  area: string;
  service: string;
  material: PipeMaterial;
  schedule: string | null;
  sdr: number | null;
  nominalSize: string;
  nominalSizeIn: number;
  designPressurePsi: number;
  designTemperatureF: number;
  drawingRef: string | null;
  notes: string | null;
}

export interface RegisterPoint {
  tag: string;
  lineNumber: string;
  kind: IsolationKind;
  normalPosition: string;
  notes: string | null;
}

export async function linesByNumber(lineNumbers: string[], t: Transaction): Promise<RegisterLine[]> {
  if (!lineNumbers.length) return [];
  return select<RegisterLine>(
    `select l.line_number as "lineNumber", area, service, material, schedule, sdr, nominal_size as "nominalSize",
            nominal_size_in as "nominalSizeIn", design_pressure_psi as "designPressurePsi", design_temperature_f as "designTemperatureF",
            drawing_ref as "drawingRef", notes
       from lines l join unnest($1::text[]) k(key) on l.line_number = k.key`,
    [lineNumbers], t,
  );
}

/** Which of these line numbers are in the register. */
export async function knownLineNumbers(lineNumbers: string[], t: Transaction): Promise<Set<string>> {
  if (!lineNumbers.length) return new Set();
  const rows = await select<{ lineNumber: string }>(
    `select l.line_number as "lineNumber" from lines l join unnest($1::text[]) k(key) on l.line_number = k.key`, [lineNumbers], t,
  );
  return new Set(rows.map((r) => r.lineNumber));
}

export async function pointsByTag(tags: string[], t: Transaction): Promise<RegisterPoint[]> {
  if (!tags.length) return [];
  return select<RegisterPoint>(
    `select ip.tag, l.line_number as "lineNumber", ip.kind, ip.normal_position as "normalPosition", ip.notes
       from isolation_points ip join unnest($1::text[]) k(key) on ip.tag = k.key join lines l on l.id = ip.line_id`,
    [tags], t,
  );
}

/** The moment as PostgreSQL's clock has it, inside `t` (after its locks were granted). */
export async function databaseNow(t: Transaction): Promise<Date> {
  const [row] = await select<{ now: Date }>('select clock_timestamp() as now', [], t);
  return row!.now;
}

// ── the preview rows ────────────────────────────────────────────────────────────────────────────

export interface PreviewRowData {
  rowNumber: number;
  outcome: RowOutcome;
  key: string | null;
  /** A rejected row's cells as written, or an isolation point's values. */
  data: Record<string, unknown> | null;
  /** A lines preview's new or changed line, written to the typed columns. */
  line: RegisterLine | null;
  changes: unknown;
  problems: unknown;
}

export async function deletePreviewRows(importId: string, t: Transaction): Promise<void> {
  await sequelize.query('delete from line_import_rows where import_id = $1', { bind: [importId], transaction: t });
}

const COPY_PREVIEW_ROWS = `copy line_import_rows (import_id, row_number, outcome, key, data, changes, problems, area, service, material,
  schedule, sdr, nominal_size, nominal_size_in, design_pressure_psi, design_temperature_f, drawing_ref, notes) from stdin`;
const NULL = '\\N';
const json = (v: unknown) => (v === null || v === undefined ? NULL : copyText(JSON.stringify(v)));
const num = (v: number | null) => (v === null ? NULL : String(v));

/**
 * One preview row as a line of `COPY line_import_rows … from stdin` (text format), without its
 * line break (join the lines with '\n', and end with one). A lines row's values go to typed
 * columns, so nothing is built or parsed as JSON for the 100,000 rows of a large file; only
 * rejected rows (their cells) and changes travel as JSON. `importId` is COPY text already. The
 * fields are joined in one step: a chain of concatenations would leave ~40 small strings a row
 * for the garbage collector.
 */
export function previewRowLine(importId: string, r: PreviewRowData): string {
  const l = r.line;
  return [
    importId, r.rowNumber, r.outcome, copyText(r.key), json(r.data), json(r.changes), json(r.problems),
    l ? copyText(l.area) : NULL, l ? copyText(l.service) : NULL, l ? l.material : NULL, l ? copyText(l.schedule) : NULL, l ? num(l.sdr) : NULL,
    l ? copyText(l.nominalSize) : NULL, l ? l.nominalSizeIn : NULL, l ? l.designPressurePsi : NULL, l ? l.designTemperatureF : NULL,
    l ? copyText(l.drawingRef) : NULL, l ? copyText(l.notes) : NULL,
  ].join('\t');
}

/** Adds preview rows, given as pieces of text made of previewRowLine's lines, with one COPY on the transaction's connection. */
export async function copyPreviewLines(parts: string[], t: Transaction): Promise<void> {
  if (parts.length) await copyIn(t, COPY_PREVIEW_ROWS, parts);
}

/** An import's status as committed now (another transaction's cancel shows at once). */
export async function importStatus(importId: string, t: Transaction): Promise<string | null> {
  const [row] = await select<{ status: string }>('select status from line_imports where id = $1', [importId], t);
  return row?.status ?? null;
}

/** The start of an import's file, enough for its header (PostgreSQL reads only that much of the stored text). */
export async function importFileStart(importId: string, chars: number, t: Transaction): Promise<{ text: string; whole: boolean }> {
  const [row] = await select<{ text: string }>('select substr(source, 1, $2) as text from line_imports where id = $1', [importId, chars], t);
  const text = row?.text ?? '';
  return { text, whole: text.length < chars };
}

// ── applying a confirmed import ─────────────────────────────────────────────────────────────────
// Rows come straight from the preview's line_import_rows, ~10k row numbers a statement, so nothing
// travels back through Node and what is written is exactly what was shown. New lines are plainly
// inserted (no ON CONFLICT: its speculative insertion cost ~30 % more): the apply holds the register
// lock and no import was applied since the preview, so a line the preview did not find is not there
// (if one were, the unique line number refuses the insert and nothing is written). Changed lines are
// updated in place.

const WRITE_RANGE = `r.import_id = $1 and r.row_number between $2 and $3`;

const INSERT_NEW_LINES = `
  insert into lines (line_number, area, service, material, schedule, sdr, nominal_size, nominal_size_in,
                     design_pressure_psi, design_temperature_f, drawing_ref, notes)
  select r.key, r.area, r.service, r.material, r.schedule, r.sdr, r.nominal_size, r.nominal_size_in, r.design_pressure_psi,
         r.design_temperature_f, r.drawing_ref, r.notes
  from line_import_rows r where ${WRITE_RANGE} and r.outcome = 'new'`;

// drawing_ref and notes follow the file only when the file has those columns ($4, $5).
const UPDATE_CHANGED_LINES = `
  update lines l set
    area = r.area, service = r.service, material = r.material, schedule = r.schedule, sdr = r.sdr, nominal_size = r.nominal_size,
    nominal_size_in = r.nominal_size_in, design_pressure_psi = r.design_pressure_psi, design_temperature_f = r.design_temperature_f,
    drawing_ref = case when $4 then r.drawing_ref else l.drawing_ref end,
    notes = case when $5 then r.notes else l.notes end,
    updated_at = now()
  from line_import_rows r
  where ${WRITE_RANGE} and r.outcome = 'changed' and l.line_number = r.key
    and (l.area, l.service, l.material, l.schedule, l.sdr, l.nominal_size, l.nominal_size_in, l.design_pressure_psi,
         l.design_temperature_f, l.drawing_ref, l.notes)
      is distinct from
        (r.area, r.service, r.material, r.schedule, r.sdr, r.nominal_size, r.nominal_size_in, r.design_pressure_psi,
         r.design_temperature_f, case when $4 then r.drawing_ref else l.drawing_ref end, case when $5 then r.notes else l.notes end)`;

const TO_WRITE = `r.import_id = $1 and r.outcome in ('new', 'changed') and r.row_number between $2 and $3`;

const UPSERT_POINTS = `
  insert into isolation_points as ip (tag, line_id, kind, normal_position, notes)
  select r.key, ln.id, r.data->>'kind', r.data->>'normalPosition', r.data->>'notes'
  from line_import_rows r join lines ln on ln.line_number = r.data->>'lineNumber'
  where ${TO_WRITE}
  on conflict (tag) do update set
    line_id = excluded.line_id, kind = excluded.kind, normal_position = excluded.normal_position,
    notes = case when $4 then excluded.notes else ip.notes end, updated_at = now()`;

/** The first isolation-point row to write whose line is not (any more) in the register. */
export async function firstRowWithMissingLine(importId: string, t: Transaction): Promise<{ rowNumber: number; lineNumber: string } | null> {
  const [missing] = await select<{ rowNumber: number; lineNumber: string }>(
    `select r.row_number as "rowNumber", r.data->>'lineNumber' as "lineNumber"
       from line_import_rows r left join lines ln on ln.line_number = r.data->>'lineNumber'
      where r.import_id = $1 and r.outcome in ('new', 'changed') and ln.id is null
      order by r.row_number limit 1`,
    [importId], t,
  );
  return missing ?? null;
}

/**
 * Writes the import's new and changed rows into the register, CHUNK_ROWS row numbers a statement.
 * `keep` says which optional columns the file carried (an absent column keeps the stored value).
 */
export async function writeImportRows(
  importId: string, kind: ImportKind, keep: { drawingRef: boolean; notes: boolean }, t: Transaction, beforeChunk: () => Promise<void>,
  onChunk: (fraction: number) => Promise<void>,
): Promise<void> {
  const [range] = await select<{ first: number | null; last: number | null }>(
    'select min(row_number) as first, max(row_number) as last from line_import_rows where import_id = $1', [importId], t,
  );
  const first = range?.first ?? 0;
  const last = range?.last ?? -1;
  const rebuild = kind === 'lines' && (await isLargeApply(importId, t));
  if (rebuild) await sequelize.query(LARGE_APPLY_INDEXES.map((i) => `drop index if exists ${i.name};`).join(' '), { transaction: t });
  const statements = kind === 'lines' ? [INSERT_NEW_LINES, UPDATE_CHANGED_LINES] : [UPSERT_POINTS];
  const flags = kind === 'lines' ? [keep.drawingRef, keep.notes] : [keep.notes];
  for (let from = first; from <= last; from += CHUNK_ROWS) {
    await beforeChunk();
    for (const sql of statements) {
      const bind = [importId, from, from + CHUNK_ROWS - 1, ...(sql === INSERT_NEW_LINES ? [] : flags)];
      await sequelize.query(sql, { bind, transaction: t });
    }
    await onChunk((from + CHUNK_ROWS - first) / (last - first + 1));
  }
  if (rebuild) for (const i of LARGE_APPLY_INDEXES) await sequelize.query(i.create, { transaction: t });
}

/**
 * The search indexes of the register (migration 20261209000100-list-speed) that a large apply drops
 * and builds again in one pass, inside its transaction: cheaper than keeping them up row by row, and
 * the search never sees them missing (other transactions wait for the apply's commit to read lines).
 */
const LARGE_APPLY_INDEXES = [
  { name: 'lines_line_number_trgm_idx', create: 'create index lines_line_number_trgm_idx on lines using gin (line_number gin_trgm_ops)' },
  { name: 'lines_pressure_idx', create: 'create index lines_pressure_idx on lines (design_pressure_psi)' },
];
/** An apply is large when it writes at least this many lines and at least as many as the register holds. */
const LARGE_APPLY_MIN_ROWS = 5_000;

async function isLargeApply(importId: string, t: Transaction): Promise<boolean> {
  const [row] = await select<{ writes: string; lines: string }>(
    `select (select count(*) from line_import_rows where import_id = $1 and outcome in ('new', 'changed')) as writes,
            (select count(*) from lines) as lines`,
    [importId], t,
  );
  const writes = Number(row?.writes ?? 0);
  return writes >= LARGE_APPLY_MIN_ROWS && writes >= Number(row?.lines ?? 0);
}

// ── the sweep ───────────────────────────────────────────────────────────────────────────────────

/** Imports still previewing or applying that nobody has touched for `graceMs`, oldest first. */
export function importsLeftInProgress(graceMs: number): Promise<{ id: string; status: 'previewing' | 'applying' }[]> {
  return select(
    `select id, status from line_imports
      where status in ('previewing', 'applying') and updated_at < now() - make_interval(secs => $1)
      order by created_at`,
    [graceMs / 1000],
  );
}
