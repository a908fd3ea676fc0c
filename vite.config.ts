import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));

// The dev server proxies the API and sign-in routes to the Express process started by `npm run dev`.
const apiTarget = process.env.LW_DEV_API ?? 'http://127.0.0.1:5180';

export default defineConfig({
  plugins: [react(), tailwindcss()],
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
