import type { QueryInterface } from 'sequelize';

export const name = '20261205000200-line-import-cancellation';

// A planner may cancel an import that is not yet written: status 'cancelled', and when.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    alter table line_imports
      drop constraint line_imports_status_check,
      add constraint line_imports_status_check check (status in ('previewing', 'previewed', 'applying', 'applied', 'failed', 'cancelled')),
      add column cancelled_at timestamptz;
    create index line_imports_created_idx on line_imports (created_at desc, id desc);
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    drop index if exists line_imports_created_idx;
    update line_imports set status = 'failed', error = coalesce(error, 'Cancelled.') where status = 'cancelled';
    alter table line_imports
      drop column cancelled_at,
      drop constraint line_imports_status_check,
      add constraint line_imports_status_check check (status in ('previewing', 'previewed', 'applying', 'applied', 'failed'));
  `);
}
