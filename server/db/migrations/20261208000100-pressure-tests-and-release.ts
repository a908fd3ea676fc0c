import type { QueryInterface } from 'sequelize';

export const name = '20261208000100-pressure-tests-and-release';

// The hydrostatic test record (ASME B31.3 345.2.7, with the (f)(1) sequence before it) and
// operations' release of the line with its checklist.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    create table pressure_tests (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null references work_orders (id) on delete cascade,
      result text not null check (result in ('passed', 'failed')),
      medium text not null,
      test_pressure_psi real not null check (test_pressure_psi > 0),
      gauge text not null,
      started_at timestamptz not null,
      start_reading_psi real not null,
      ended_at timestamptz not null,
      end_reading_psi real not null,
      leaking_joint_ids uuid[] not null default '{}',
      piping_identified text not null,
      examiner text not null,
      notes text,
      witness_id uuid not null references people (id),
      recorded_at timestamptz not null,
      check (ended_at > started_at),
      check ((result = 'failed') = (cardinality(leaking_joint_ids) > 0))
    );
    create index pressure_tests_order_idx on pressure_tests (work_order_id, recorded_at desc);

    create table releases (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null unique references work_orders (id) on delete cascade,
      released_by_id uuid not null references people (id),
      released_at timestamptz not null,
      checklist jsonb not null,
      notes text
    );
    alter table work_orders add column released_at timestamptz;
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    alter table work_orders drop column if exists released_at;
    drop table if exists releases, pressure_tests;
  `);
}
