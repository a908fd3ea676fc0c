import type { QueryInterface } from 'sequelize';

export const name = '20261208000450-lock-left-on-setting';

// How long a lock may stay on after an order's cure holds have all run out (its test waits on the
// lock) before a supervisor is told; null is the shipped default.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    alter table plant_settings add column lock_left_on_minutes integer check (lock_left_on_minutes between 5 and 1440);
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('alter table plant_settings drop column if exists lock_left_on_minutes;');
}
