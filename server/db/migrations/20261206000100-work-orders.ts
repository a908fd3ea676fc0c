import type { QueryInterface } from 'sequelize';

export const name = '20261206000100-work-orders';

// Work orders (DESIGN.md sections 3, 7 and 8): the order, its lines, its joint tasks and its
// isolation plan, a per-year counter for the readable number, and the plant's window-plan
// minutes and time zone. The lists in the checks are the ones in shared/schemas/work-orders.ts,
// shared/schemas/joint-tasks.ts and shared/schemas/isolation-plans.ts.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    -- One row per year; the create transaction raises it, so two orders never share a number.
    create table work_order_numbers (
      year integer primary key,
      last_number integer not null
    );

    create table work_orders (
      id uuid primary key default gen_random_uuid(),
      number text not null unique,
      kind text not null check (kind in ('repair', 'tie-in', 'replacement')),
      priority text not null check (priority in ('routine', 'soon', 'urgent', 'emergency')),
      scope text not null,
      requested_by text not null,
      window_start timestamptz,
      window_end timestamptz,
      forecast_low_f real,
      forecast_high_rh real check (forecast_high_rh between 0 and 100),
      test_pressure_psi real check (test_pressure_psi > 0),
      component_rating_psi real check (component_rating_psi > 0),
      state text not null default 'draft'
        check (state in ('draft', 'planned', 'isolated', 'in-work', 'curing', 'testing', 'ready', 'released', 'closed', 'cancelled')),
      late_reason text,
      cancel_reason text,
      planned_at timestamptz,
      cancelled_at timestamptz,
      last_joint_number integer not null default 0,
      created_by_id uuid not null references people (id),
      version integer not null default 1,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      check ((window_start is null) = (window_end is null)),
      check (window_end > window_start),
      check (state <> 'cancelled' or cancel_reason is not null)
    );
    create index work_orders_state_idx on work_orders (state);
    create index work_orders_window_idx on work_orders (window_start, window_end);
    create index work_orders_created_idx on work_orders (created_at desc, id desc);

    create table work_order_lines (
      work_order_id uuid not null references work_orders (id) on delete cascade,
      line_id uuid not null references lines (id),
      primary key (work_order_id, line_id)
    );
    create index work_order_lines_line_idx on work_order_lines (line_id, work_order_id);

    -- One joint to make. nominal_size is the line's size; a reducing tee or bushing's joint on its
    -- smaller outlet carries that size in reducing_size, and the trade rules use it for that joint.
    create table joint_tasks (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null references work_orders (id) on delete cascade,
      number integer not null check (number > 0),
      line_id uuid not null references lines (id),
      fitting_kind text not null
        check (fitting_kind in ('coupling', 'tee', 'elbow-90', 'elbow-45', 'socket-flange', 'union', 'reducing-bushing', 'cap')),
      nominal_size text not null,
      nominal_size_in real not null,
      reducing_size text,
      reducing_size_in real,
      fitter_id uuid references people (id),
      replaces_task_id uuid references joint_tasks (id),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (work_order_id, number),
      check ((reducing_size is null) = (reducing_size_in is null)),
      check (reducing_size_in is null or (fitting_kind in ('tee', 'reducing-bushing') and reducing_size_in < nominal_size_in))
    );
    create index joint_tasks_fitter_idx on joint_tasks (fitter_id, work_order_id) where fitter_id is not null;
    create index joint_tasks_line_idx on joint_tasks (line_id);

    -- A register point (valve, blind, disconnect) or a drain or vent point that the register does not hold.
    create table isolation_plan_entries (
      id uuid primary key default gen_random_uuid(),
      work_order_id uuid not null references work_orders (id) on delete cascade,
      isolation_point_id uuid references isolation_points (id),
      line_id uuid not null references lines (id),
      tag text not null,
      kind text not null check (kind in ('valve', 'blind', 'disconnect', 'drain', 'vent')),
      required_position text not null,
      sort_order integer not null,
      created_at timestamptz not null default now(),
      unique (work_order_id, tag),
      check ((isolation_point_id is null) = (kind in ('drain', 'vent')))
    );
    create index isolation_plan_entries_point_idx on isolation_plan_entries (isolation_point_id, work_order_id) where isolation_point_id is not null;

    -- The plant's window-plan minutes as an administrator set them (keys left out are the defaults
    -- of shared/schemas/plant-settings.ts), and its time zone (null: the default).
    alter table plant_settings
      add column window_plan jsonb not null default '{}',
      add column time_zone text;
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    alter table plant_settings drop column if exists window_plan, drop column if exists time_zone;
    drop table if exists isolation_plan_entries, joint_tasks, work_order_lines, work_orders, work_order_numbers;
  `);
}
