/// <reference types="vite-plugin-pwa/vanillajs" />
import { StrictMode } from 'react';
import { registerSW } from 'virtual:pwa-register';
import { createRoot } from 'react-dom/client';
import '@fontsource/inter-tight/400.css';
import '@fontsource/inter-tight/500.css';
import '@fontsource/inter-tight/600.css';
import '@fontsource/inter-tight/700.css';
import './index.css';
import { AppProvider } from '@/app/provider';
import { reloadOnNextPage } from '@/app/reload-on-update';
import { signedInThisLoad } from '@/lib/offline-writes';

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <AppProvider />
  </StrictMode>,
);

// The app shell's service worker (production builds; a no-op under the dev server), once someone is
// signed in (see signedInThisLoad). A new build takes over at once; the app moves to it at the next page change.
void signedInThisLoad.then(() => registerSW({ immediate: true, onNeedReload: reloadOnNextPage }));
