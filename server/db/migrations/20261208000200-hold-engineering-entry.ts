import type { QueryInterface } from 'sequelize';

export const name = '20261208000200-hold-engineering-entry';

// A supervisor's engineering cure time for a hold the trade engine refused (outside the published
// tables): who entered it, why, and the minutes, kept on the hold so every record that shows it says so.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    alter table holds
      add column engineering_by_id uuid references people (id),
      add column engineering_reason text,
      add column engineering_minutes integer check (engineering_minutes > 0),
      add constraint holds_engineering_check check ((engineering_by_id is null) = (engineering_reason is null) and (engineering_reason is null) = (engineering_minutes is null));
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    alter table holds drop constraint if exists holds_engineering_check,
      drop column if exists engineering_by_id, drop column if exists engineering_reason, drop column if exists engineering_minutes;
  `);
}
