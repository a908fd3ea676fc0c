import type { QueryInterface } from 'sequelize';

export const name = '20261204000100-plant-settings-version';

// Each save of the plant settings raises the version; a save made from an older version is refused.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('alter table plant_settings add column version integer not null default 1');
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('alter table plant_settings drop column if exists version');
}
