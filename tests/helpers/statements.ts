import { sequelize } from '@server/db/sequelize';

/**
 * How many SQL statements the app's data access sends while `work` runs (Sequelize's, which every
 * service uses; the session store's own reads are not among them).
 */
export async function statementsOf(work: () => Promise<unknown>): Promise<number> {
  let n = 0;
  const count = () => void n++;
  sequelize.addHook('beforeQuery', 'count-statements', count);
  try {
    await work();
  } finally {
    sequelize.removeHook('beforeQuery', 'count-statements');
  }
  return n;
}
