import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';
import { compression } from 'vite-plugin-compression2';
import type { Plugin } from 'vite';

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
    globPatterns: ['**/*.{js,css,html,svg}', '**/*latin-wght-normal*.woff2', '**/*latin-ext-wght-normal*.woff2'],
    // the pre-compressed copies are the same files for the server's content negotiation, never the worker's
    globIgnores: ['**/*.{br,gz}'],
    navigateFallback: '/index.html',
    navigateFallbackDenylist: [/^\/api/, /^\/auth/],
    cleanupOutdatedCaches: true,
    // autoUpdate: a new build's worker takes over at once (src/main.tsx moves the app to it at the next page change).
    skipWaiting: true,
    clientsClaim: true,
  },
});

/**
 * Brotli and gzip copies of every text asset next to it (the server answers with the one the browser
 * accepts). woff2 is compressed already, and the .woff files are only a fallback nobody here fetches.
 */
const precompressed = compression({
  include: /\.(js|css|html|svg|webmanifest|json)$/,
  algorithms: ['brotliCompress', 'gzip'],
  threshold: 1024,
  skipIfLargerOrEqual: true,
  logLevel: 'silent',
});

/**
 * The first screen's font, asked for with the page instead of after the CSS is applied and the text
 * laid out: the latin subset of the variable file, which carries every weight the screens use
 * (regular text, medium navigation, semibold names and headers, bold headings). Other subsets
 * still load when a name needs them (unicode-range, font-display: swap).
 */
const FIRST_SCREEN_FONTS = /^assets\/inter-tight-latin-wght-normal-[\w-]+\.woff2$/;
function preloadFirstScreenFonts(): Plugin {
  return {
    name: 'linewright:preload-first-screen-fonts',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler: (_html, ctx) =>
        Object.keys(ctx.bundle ?? {})
          .filter((file) => FIRST_SCREEN_FONTS.test(file))
          .sort()
          .map((file) => ({ tag: 'link', attrs: { rel: 'preload', as: 'font', type: 'font/woff2', href: `/${file}`, crossorigin: '' }, injectTo: 'head' as const })),
    },
  };
}

const TRADE = /[\\/]shared[\\/]trade[\\/]/;

export default defineConfig({
  plugins: [react(), tailwindcss(), preloadFirstScreenFonts(), pwa, precompressed],
  resolve: { alias: { '@': here('./src'), '@shared': here('./shared') } },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    sourcemap: false,
    // No <link rel=modulepreload>: Chromium compiles a module-preloaded chunk on the main thread as
    // it arrives (the React chunk: 0.4–0.7 s of a tablet's main thread at 4× CPU slowdown, measured
    // in a trace), while the chunks the entry imports are compiled off the main thread as they
    // stream in. The cost is one round trip: the entry's imports are found when it arrives. Cold
    // /lines at 4×: largest contentful paint 2.5 s against 3.2 s with the preloads. The register's
    // page is in the first bundle (src/app/router.tsx imports it).
    modulePreload: false,
    // Libraries that only some pages use get chunks of their own, so the first page loads less.
    rolldownOptions: {
      // shared/trade is pure (no I/O, no clock, no module state: STYLE.md habit 7), so a page that takes one
      // rule or list from its index (the only way in) gets that module, not every table and zod (the joint
      // specification's schema) with it: the register's first screen needs only the materials and the units.
      treeshake: { moduleSideEffects: (id) => (TRADE.test(id) ? false : undefined) },
      output: {
        codeSplitting: {
          // React is taken first (highest priority): a group takes its modules' dependencies with it, so
          // 'forms' listed first took React in, and the first page then loaded the form library too.
          groups: [
            { name: 'react', test: /node_modules[\\/](react|react-dom|scheduler|react-router|react-router-dom)[\\/]/, priority: 40 },
            { name: 'forms', test: /node_modules[\\/](react-hook-form|@hookform)/, priority: 30 },
            { name: 'zod', test: /node_modules[\\/]zod/, priority: 20 },
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
