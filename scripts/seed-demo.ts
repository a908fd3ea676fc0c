// Loads the demo plant once, through the product's own import (preview, then confirm), as the
// system person "Linewright (demo loader)". An audit entry 'demo-loaded' marks it done, so a
// second `npm start` keeps whatever the register holds by then. Then, once too, the demo work
// orders (scripts/demo-orders.ts), made through the work-order services by the demo people.
// `tsx scripts/seed-demo.ts --write-samples` rewrites docs/sample-*.csv from the same plant.

import { writeFileSync } from 'node:fs';
import path from 'node:path';
import { SITE, demoPlant, sampleFiles, toCsv } from './demo-plant';
import { ROOT } from './lib/processes';

const log = (msg: string) => console.log(`[linewright] demo plant: ${msg}`);

async function load(): Promise<void> {
  // Server modules read the environment when imported; npm start has set it by now.
  const { sequelize } = await import('../server/db/sequelize');
  const { closeQueues } = await import('../server/queues/connection');
  try {
    await loadPlant();
    const { loadDemoOrders } = await import('./demo-orders');
    log((await loadDemoOrders()).message);
  } finally {
    await closeQueues(); // a late plan's mail opened the queue's Redis connection
    await sequelize.close();
  }
}

async function loadPlant(): Promise<void> {
  const { AuditEntry } = await import('../server/db/models/audit-entry');
  const { Person } = await import('../server/db/models/person');
  const { recordAudit } = await import('../server/services/audit-service');
  const { confirmImport, uploadImport } = await import('../server/services/line-imports/import-service');
  if (await AuditEntry.findOne({ where: { action: 'demo-loaded' } })) return log(`${SITE} was loaded before; the register is left as it is.`);
  const [person] = await Person.findOrCreate({
    where: { issuer: 'linewright', subject: 'system' },
    defaults: { issuer: 'linewright', subject: 'system', name: 'Linewright (demo loader)', email: null, lastSignInAt: null },
  });
  const me = { id: person.id, name: person.name, email: null, roles: [] };
  const { lines, points } = demoPlant();
  const counts: Record<string, unknown> = {};
  for (const [filename, rows] of [['marrowby-reach-lines.csv', lines], ['marrowby-reach-isolation-points.csv', points]] as const) {
    const preview = await uploadImport(me, { filename, buffer: Buffer.from(toCsv(rows)) }, { inline: true });
    if (preview.counts.rejected) throw new Error(`${filename}: ${preview.counts.rejected} rows rejected; the demo plant generator is wrong`);
    const applied = await confirmImport(me, preview.id, { inline: true });
    counts[filename] = applied.counts;
  }
  await recordAudit({ actorId: person.id, action: 'demo-loaded', entity: 'demo-plant', entityId: SITE, after: { lines: lines.length, isolationPoints: points.length } });
  log(`${SITE} loaded: ${lines.length} lines, ${points.length} isolation points.`);
}

function writeSamples(): void {
  const { lines, points } = sampleFiles();
  writeFileSync(path.join(ROOT, 'docs', 'sample-lines.csv'), lines);
  writeFileSync(path.join(ROOT, 'docs', 'sample-isolation-points.csv'), points);
  log('docs/sample-lines.csv and docs/sample-isolation-points.csv written.');
}

if (process.argv.includes('--write-samples')) writeSamples();
else {
  load().catch((err) => {
    console.error(`[linewright] demo plant could not be loaded: ${err.message}`);
    process.exit(1);
  });
}
