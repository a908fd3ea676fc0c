import type { QueryInterface } from 'sequelize';

export const name = '20261208000300-sent-mails';

// Each mail job's id once it is being sent: a job that runs twice (a retry after a lost answer, two
// workers, a job queued again after Redis forgot the first) sends its mail once.
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    create table sent_mails (
      job_id text primary key,
      claimed_at timestamptz not null default now(),
      sent_at timestamptz
    );
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query('drop table if exists sent_mails;');
}
