import type { QueryInterface } from 'sequelize';

export const name = '20261203000200-drop-line-search-trigram';

// The trigram index on lines.line_number (20261202000200) was the costliest index to keep up
// while importing: of a 100,000-row \copy into a table with the register's indexes (~2.2 s),
// about 0.9 s was the trigram index alone. The search it served is a case-insensitive
// substring match (`line_number ilike '%…%'`) over a register of at most ~100k lines, which a
// sequential scan answers in ~60 ms (measured: 100,000 lines, 2 ms with the index for a
// selective search, 55–60 ms without; a broad search took ~56 ms either way).
// The extension stays installed (the earlier migration created it; nothing else needs it gone).
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('drop index if exists lines_line_number_trgm_idx');
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('create index if not exists lines_line_number_trgm_idx on lines using gin (line_number gin_trgm_ops)');
}
