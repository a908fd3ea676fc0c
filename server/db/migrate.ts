import { SequelizeStorage, Umzug } from 'umzug';
import { sequelize } from '@server/db/sequelize';
import * as createRegister from '@server/db/migrations/20261202000100-create-register';
import * as lineSearchIndex from '@server/db/migrations/20261202000200-line-search-index';
import * as plantSettings from '@server/db/migrations/20261202000300-plant-settings';
import * as lineImportPreviewedAt from '@server/db/migrations/20261203000100-line-import-previewed-at';
import * as dropLineSearchTrigram from '@server/db/migrations/20261203000200-drop-line-search-trigram';
import * as plantSettingsVersion from '@server/db/migrations/20261204000100-plant-settings-version';
import * as lineImportPreviewSpeed from '@server/db/migrations/20261205000100-line-import-preview-speed';
import * as lineImportCancellation from '@server/db/migrations/20261205000200-line-import-cancellation';
import * as workOrders from '@server/db/migrations/20261206000100-work-orders';
import * as workOrderWindowIndex from '@server/db/migrations/20261206000200-work-order-window-index';
import * as lockoutAndJointSteps from '@server/db/migrations/20261207000100-lockout-and-joint-steps';
import * as pressureTestsAndRelease from '@server/db/migrations/20261208000100-pressure-tests-and-release';
import * as holdEngineeringEntry from '@server/db/migrations/20261208000200-hold-engineering-entry';
import * as sentMails from '@server/db/migrations/20261208000300-sent-mails';
import * as temperatureLogs from '@server/db/migrations/20261208000400-temperature-logs';
import * as lockLeftOnSetting from '@server/db/migrations/20261208000450-lock-left-on-setting';
import * as listSpeed from '@server/db/migrations/20261209000100-list-speed';
import * as changeTopics from '@server/db/migrations/20261210000100-change-topics';

// Listed by hand, oldest first: a glob of .ts files does not resolve under vitest.
const migrations = [
  createRegister, lineSearchIndex, plantSettings, lineImportPreviewedAt, dropLineSearchTrigram, plantSettingsVersion,
  lineImportPreviewSpeed, lineImportCancellation, workOrders, workOrderWindowIndex, lockoutAndJointSteps,
  pressureTestsAndRelease, holdEngineeringEntry, sentMails, temperatureLogs, lockLeftOnSetting, listSpeed, changeTopics,
];

export function migrator() {
  return new Umzug({
    migrations: migrations.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

export async function migrate(): Promise<string[]> {
  const done = await migrator().up();
  return done.map((m) => m.name);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const direction = process.argv[2] ?? 'up';
  const run = direction === 'down' ? migrator().down() : migrate();
  run
    .then(() => sequelize.close())
    .catch((err) => {
      console.error(err);
      process.exit(1);
    });
}
