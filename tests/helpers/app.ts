import { createServer, type Server } from 'node:http';
import { afterAll, beforeAll } from 'vitest';
import { createApp } from '@server/app';
import { signedIn, type Browserless } from './browserless';
import { TEST_PORTS } from './ports';

/** Starts the real app on the test port the sign-in fake knows; call the result to stop it. */
export async function startTestApp(): Promise<() => Promise<void>> {
  const server: Server = createServer(createApp());
  await new Promise<void>((resolve, reject) => server.once('error', reject).listen(TEST_PORTS.app, '127.0.0.1', () => resolve()));
  return () => new Promise((resolve) => (server.closeAllConnections(), server.close(() => resolve())));
}

/**
 * The start-up every API test file shares: the real app is started before the file's tests and
 * stopped after them, and each demo account named in `signIn` is signed in once, through the
 * identity provider, before the first test. `before` runs first (e.g. putting plant settings back).
 *
 *   const users = useTestApp({ signIn: ['planner'] });
 *   it('…', async () => { await users.planner.get('/api/lines'); });
 */
export function useTestApp<U extends string = never>(opts: { signIn?: readonly U[]; before?: () => Promise<unknown> } = {}): Record<U, Browserless> {
  const users = {} as Record<U, Browserless>;
  let stop: (() => Promise<void>) | undefined;
  beforeAll(async () => {
    await opts.before?.();
    stop = await startTestApp();
    for (const username of opts.signIn ?? []) users[username] = await signedIn(username);
  });
  afterAll(() => stop?.());
  return users;
}
