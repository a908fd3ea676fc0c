import type { QueryInterface } from 'sequelize';

export const name = '20261208000400-temperature-logs';

// A data logger's temperature record uploaded for an order during its cure: the readings as read,
// what could not be read, and whether it has been applied to the holds (a log only lengthens them).
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    create table temperature_logs (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null references work_orders (id) on delete cascade,
      file_name text not null,
      uploaded_by_id uuid not null references people (id),
      uploaded_at timestamptz not null,
      unit text check (unit in ('F', 'C')),
      readings jsonb not null,
      problems jsonb not null,
      status text not null check (status in ('previewed', 'applied')),
      applied_by_id uuid references people (id),
      applied_at timestamptz
    );
    create index temperature_logs_order_idx on temperature_logs (work_order_id, uploaded_at);
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('drop table if exists temperature_logs;');
}
