import { logger } from '@server/logger';
import { sequelize } from '@server/db/sequelize';
import { closeQueues } from '@server/queues/connection';
import { startWorkers } from './workers';

const running = startWorkers();

async function shutdown() {
  await running.close();
  await closeQueues();
  await sequelize.close();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown());
process.on('SIGTERM', () => void shutdown());
// Last: whoever waits for this line (a test, a supervisor) may signal at once. Logged before the
// handlers, a SIGTERM that came between the line (written synchronously to a pipe) and them killed
// the worker instead of stopping it.
logger.info('Linewright worker started');
