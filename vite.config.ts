import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));

// The dev server proxies the API and sign-in routes to the Express process started by `npm run dev`.
const apiTarget = process.env.LW_DEV_API ?? 'http://127.0.0.1:5180';

/**
 * The service worker caches the app shell, so the shift tablet reloads into the app with no network;
 * the data and the queued writes are the app's own (src/lib/tablet-cache.ts), never the worker's.
 * It only builds: the dev server gets the no-op register and keeps its hot reload.
 */
const pwa = VitePWA({
  strategies: 'generateSW',
  registerType: 'autoUpdate',
  injectRegister: false, // src/main.tsx registers it (no inline script under the CSP)
  manifest: {
    name: 'Linewright',
    short_name: 'Linewright',
    description: 'Repairs and tie-ins on thermoplastic process lines: joints, lockout, cure holds and release.',
    start_url: '/',
    scope: '/',
    display: 'standalone',
    background_color: '#f6f5f1',
    theme_color: '#1d2731',
    icons: [],
  },
  workbox: {
    // woff2 only (every browser the tablet runs reads it) and the latin subsets the screens use;
    // the other subsets still load from the network when a name needs them
    globPatterns: ['**/*.{js,css,html,svg}', '**/*latin-[0-9]*.woff2', '**/*latin-ext-[0-9]*.woff2'],
    navigateFallback: '/index.html',
    navigateFallbackDenylist: [/^\/api/, /^\/auth/],
    cleanupOutdatedCaches: true,
    // autoUpdate: a new build's worker takes over at once (src/main.tsx moves the app to it at the next page change).
    skipWaiting: true,
    clientsClaim: true,
  },
});

export default defineConfig({
  plugins: [react(), tailwindcss(), pwa],
  resolve: { alias: { '@': here('./src'), '@shared': here('./shared') } },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    sourcemap: false,
    // Libraries that only some pages use get chunks of their own, so the first page loads less.
    rolldownOptions: {
      output: {
        codeSplitting: {
          groups: [
            { name: 'forms', test: /node_modules[\\/](react-hook-form|@hookform)/ },
            { name: 'zod', test: /node_modules[\\/]zod/ },
            { name: 'table', test: /node_modules[\\/]@tanstack[\\/](react-table|table-core)/ },
            { name: 'react', test: /node_modules[\\/](react|react-dom|scheduler|react-router|react-router-dom)[\\/]/ },
          ],
        },
      },
    },
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': apiTarget, '/auth': apiTarget },
  },
});
