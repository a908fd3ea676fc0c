import type { QueryInterface } from 'sequelize';

export const name = '20261209000100-list-speed';

// What the lists need to answer fast at 100,000 lines and 10,000 orders (issue 11):
//
// - change_log: one row per statement that writes the register or the work orders, written by a
//   statement trigger with the writing transaction's id. A list keeps its count and facets with
//   the snapshot they were counted in (server/db/change-log.ts) and reuses them until a row of a
//   transaction that snapshot did not see appears: exact, across processes, and a write pays one
//   small insert per statement (an import of 100,000 lines: about a dozen), never per row.
//   Inserts only, so writers never wait on each other here; old rows go in a sweep.
// - A trigram index for the line-number search (`ilike '%…%'`). 20261203000200 dropped the first
//   one because the import paid ~0.9 s to keep it up row by row. A large apply now drops it and
//   builds it again in one pass inside its own transaction (LARGE_APPLY_INDEXES in
//   server/db/queries/line-imports.ts), which costs a fraction of keeping it up row by row (GIN's
//   pending list, measured, did not save enough); a small import keeps it up as it goes.
// - Pressure order for a filtered register page: walks the index until it has a page, whatever
//   the register's size (ties by line number are sorted a few at a time). Rebuilt like the
//   trigram index. Line number, area and size already have theirs.
// - Orders by state in window order: the default list (one state, window order) walks the index.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    create table change_log (
      id bigserial primary key,
      topic text not null,
      xid xid8 not null default pg_current_xact_id(),
      at timestamptz not null default clock_timestamp()
    );
    create index change_log_xid_idx on change_log (xid);

    create function log_change() returns trigger language plpgsql as $$
    begin
      insert into change_log (topic) values (tg_argv[0]);
      return null;
    end $$;

    create trigger lines_change_log after insert or update or delete or truncate on lines
      for each statement execute function log_change('lines');
    create trigger work_orders_change_log after insert or update or delete or truncate on work_orders
      for each statement execute function log_change('work-orders');
    create trigger work_order_lines_change_log after insert or update or delete or truncate on work_order_lines
      for each statement execute function log_change('work-orders');
    create trigger joint_tasks_change_log after insert or update of fitter_id, work_order_id or delete or truncate on joint_tasks
      for each statement execute function log_change('work-orders');

    create extension if not exists pg_trgm;
    create index lines_line_number_trgm_idx on lines using gin (line_number gin_trgm_ops);
    create index lines_pressure_idx on lines (design_pressure_psi);
    create index work_orders_state_window_idx on work_orders (state, window_start, number);
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    drop index if exists work_orders_state_window_idx;
    drop index if exists lines_pressure_idx;
    drop index if exists lines_line_number_trgm_idx;
    drop trigger if exists joint_tasks_change_log on joint_tasks;
    drop trigger if exists work_order_lines_change_log on work_order_lines;
    drop trigger if exists work_orders_change_log on work_orders;
    drop trigger if exists lines_change_log on lines;
    drop function if exists log_change();
    drop table if exists change_log;
  `);
}
