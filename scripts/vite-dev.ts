import { createServer } from 'vite';

// `npm run dev`: Vite's hot-reloading client on :5173, proxying /api and /auth to the API.
const server = await createServer({ configFile: 'vite.config.ts' });
await server.listen();
server.printUrls();
