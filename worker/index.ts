import { logger } from '@server/logger';
import { sequelize } from '@server/db/sequelize';
import { closeQueues } from '@server/queues/connection';
import { startWorkers } from './workers';

const running = startWorkers();
logger.info('Linewright worker started');

async function shutdown() {
  await running.close();
  await closeQueues();
  await sequelize.close();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown());
process.on('SIGTERM', () => void shutdown());
