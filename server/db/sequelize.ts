import { Sequelize } from 'sequelize';
import { config } from '@server/config';
import { logger } from '@server/logger';

export const sequelize = new Sequelize(config.databaseUrl, {
  dialect: 'postgres',
  logging: config.logLevel === 'trace' ? (sql) => logger.trace(sql) : false,
  pool: { max: 10, min: 0, idle: 10_000 },
  define: { underscored: true },
});
