import type { QueryInterface } from 'sequelize';

export const name = '20261202000300-plant-settings';

// One row: the plant's choices for the trade rules. The check on id keeps it one row.
// 'A' is DEFAULT_CURE_SCHEDULE_ID in shared/trade/cure-tables.ts; the schedule id itself is
// checked by the API against listCureSchedules(), since the tables live in code, not here.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    create table plant_settings (
      id smallint primary key default 1 check (id = 1),
      cure_schedule_id text not null default 'A',
      test_cap text not null default 'rating' check (test_cap in ('rating', 'one-and-a-half-rating')),
      updated_by_id uuid references people (id),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now()
    );
    insert into plant_settings (id) values (1);
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('drop table if exists plant_settings;');
}
