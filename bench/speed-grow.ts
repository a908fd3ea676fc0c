// The speed bench's register growth in a child process (BENCH_GROW = { loader, from, count, filename }):
// the line import of `count` plant-like lines through the services, as bench/speed-bench.ts did
// in-process. Apart, so that the 100,000-line import's garbage and caches do not stay in the
// process that serves the measured requests. The environment (DATABASE_URL, …) is the bench's.

import type { Me } from '@shared/schemas/roles';

const spec = JSON.parse(process.env.BENCH_GROW!) as { loader: Me; from: number; count: number; filename: string };
const { importCsv, plantLinesCsv } = await import('./speed-fill');
const { sequelize } = await import('../server/db/sequelize');
const { closeQueues } = await import('../server/queues/connection');
await importCsv(spec.loader, spec.filename, plantLinesCsv(spec.from, spec.count));
await closeQueues();
await sequelize.close();
process.exit(0);
