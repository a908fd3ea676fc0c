import { createServer } from 'node:http';
import { config } from '@server/config';
import { createApp } from '@server/app';
import { sequelize } from '@server/db/sequelize';
import { closeQueues } from '@server/queues/connection';
import { logger } from '@server/logger';
import { closeRateLimiters } from '@server/middleware/rate-limit';

const server = createServer(createApp());
server.listen(config.port, config.host, () => logger.info({ origin: config.origin }, 'Linewright API listening'));

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'shutting down');
  server.close();
  server.closeIdleConnections();
  await closeQueues();
  await closeRateLimiters();
  await sequelize.close();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
