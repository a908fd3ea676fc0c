import type { QueryInterface } from 'sequelize';

export const name = '20261202000200-line-search-index';

// The register's search is a case-insensitive substring match on the line number
// (`line_number ilike '%…%'`), which a b-tree cannot serve; a trigram index can.
// pg_trgm is a trusted extension (PostgreSQL 13+): a role with CREATE on the database may add it.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    create extension if not exists pg_trgm;
    create index lines_line_number_trgm_idx on lines using gin (line_number gin_trgm_ops);
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  // The extension stays: other indexes may come to use it.
  await qi.sequelize.query('drop index if exists lines_line_number_trgm_idx;');
}
