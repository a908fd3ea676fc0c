import type { QueryInterface } from 'sequelize';

export const name = '20261203000100-line-import-previewed-at';

// When a preview read the register: a confirm is refused once another import was applied after it.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('alter table line_imports add column previewed_at timestamptz');
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('alter table line_imports drop column if exists previewed_at');
}
