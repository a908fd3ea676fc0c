// A worker killed with -9 loses nothing: the holds that came due while no worker ran are lifted by
// the next worker that starts (its sweep reads PostgreSQL), and a graceful SIGTERM stops a worker cleanly.
import { spawn, type ChildProcess } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import { Hold } from '@server/db/models/joint-record';
import { WorkOrder } from '@server/db/models/work-order';
import { closeQueues } from '@server/queues/connection';
import { useTestApp } from '../helpers/app';
import { waitFor } from '../helpers/import-csv';
import { isolatedOrder, recordStepsThrough } from '../helpers/lockout';
import { plantForWorkOrders } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'fitter', 'operations'], before: plantForWorkOrders });
const children: ChildProcess[] = [];
afterAll(async () => {
  const running = children.filter((c) => c.exitCode === null && c.signalCode === null);
  for (const c of running) c.kill('SIGKILL');
  await Promise.all(running.map(exited));
  await closeQueues();
});

/** A real worker process, as `npm start` runs it, on the test services. */
function startWorker(): ChildProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', 'worker/index.ts'], { env: { ...process.env, LW_PROCESS: 'worker' }, stdio: 'ignore' });
  children.push(child);
  return child;
}
const exited = (c: ChildProcess) => new Promise<number | null>((ok) => (c.exitCode !== null || c.signalCode !== null ? ok(c.exitCode) : c.once('exit', (code) => ok(code))));

describe('a worker process', () => {
  it('killed with -9 and restarted lifts every hold that came due meanwhile', async () => {
    const { order, jointIds } = await isolatedOrder(users, { joints: 1 });
    await recordStepsThrough(users.fitter, jointIds[0]!, 'wipe');
    const first = startWorker();
    await new Promise((r) => setTimeout(r, 3000)); // up and waiting on its queues
    first.kill('SIGKILL');
    await exited(first);
    // While no worker runs, both holds come due (moved back as a temperature log or a long wait would leave them).
    for (const h of await Hold.findAll({ where: { jointTaskId: jointIds[0] } })) {
      const back = h.endsAt!.getTime() - (Date.now() - 1000);
      await h.update({ startsAt: new Date(h.startsAt.getTime() - back), endsAt: new Date(h.endsAt!.getTime() - back) });
    }
    startWorker();
    const holds = await waitFor('the restarted worker to lift both holds', () => Hold.findAll({ where: { jointTaskId: jointIds[0] } }), (hs) => hs.every((h) => h.status === 'ended'), 40_000);
    expect(holds.map((h) => h.status)).toEqual(['ended', 'ended']);
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('testing');
  }, 60_000);

  it('stops cleanly on SIGTERM', async () => {
    // its log says when it is up (its signal handlers are on by then): a loaded machine may take many seconds to load it
    const worker = spawn(process.execPath, ['--import', 'tsx', 'worker/index.ts'], { env: { ...process.env, LW_PROCESS: 'worker', LOG_LEVEL: 'info' }, stdio: ['ignore', 'pipe', 'ignore'] });
    children.push(worker);
    await new Promise<void>((resolve) => {
      let out = '';
      worker.stdout!.on('data', (d) => {
        out += d;
        if (out.includes('Linewright worker started')) resolve();
      });
    });
    worker.kill('SIGTERM');
    expect(await exited(worker)).toBe(0);
  }, 30_000);
});
