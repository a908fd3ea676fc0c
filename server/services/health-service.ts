import { sequelize } from '@server/db/sequelize';

/** Whether PostgreSQL answers: the one thing the app cannot serve anyone without. */
export async function checkHealth(): Promise<{ ok: true }> {
  await sequelize.query('select 1');
  return { ok: true };
}
