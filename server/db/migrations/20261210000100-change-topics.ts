import type { QueryInterface } from 'sequelize';

export const name = '20261210000100-change-topics';

// More tables write change_log rows (server/db/change-log.ts), so more answers can be kept until
// their data changes:
// - 'lines' also when isolation points change: a register page counts each line's points.
// - 'release': everything the release queue and the line status board read besides the orders and
//   the register — lockout, verification, joints and their steps, holds, pressure tests, releases,
//   the plant settings they word blockers with, and people (the names of lock owners).
//   joint_tasks writes 'work-orders' only for the columns the order list reads; any change of a
//   joint writes 'release'.
const RELEASE_TABLES = [
  'isolation_plan_entries', 'isolation_verifications', 'lock_boxes', 'locks', 'joint_tasks', 'joint_steps',
  'holds', 'pressure_tests', 'releases', 'plant_settings', 'people',
];

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    create trigger isolation_points_change_log after insert or update or delete or truncate on isolation_points
      for each statement execute function log_change('lines');
    ${RELEASE_TABLES.map((t) => `create trigger ${t}_release_change_log after insert or update or delete or truncate on ${t}
      for each statement execute function log_change('release');`).join('\n')}
  `);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(`
    drop trigger if exists isolation_points_change_log on isolation_points;
    ${RELEASE_TABLES.map((t) => `drop trigger if exists ${t}_release_change_log on ${t};`).join('\n')}
  `);
}
