import { createServer, type Server } from 'node:http';
import { createApp } from '@server/app';
import { TEST_PORTS } from './ports';

/** Starts the real app on the test port the sign-in fake knows; call the result to stop it. */
export async function startTestApp(): Promise<() => Promise<void>> {
  const server: Server = createServer(createApp());
  await new Promise<void>((resolve, reject) => server.once('error', reject).listen(TEST_PORTS.app, '127.0.0.1', () => resolve()));
  return () => new Promise((resolve) => (server.closeAllConnections(), server.close(() => resolve())));
}
