/// <reference types="vite-plugin-pwa/vanillajs" />
// First: asks for the first screen's data before the rest of the app's code starts up.
import '@/app/first-screen-fetch';
import { StrictMode } from 'react';
import { registerSW } from 'virtual:pwa-register';
import { createRoot } from 'react-dom/client';
// One variable file carries every weight the screens use (400–700): half the bytes of four static files.
import '@fontsource-variable/inter-tight/wght.css';
import './index.css';
import { AppProvider } from '@/app/provider';
import { reloadOnNextPage } from '@/app/reload-on-update';
import { firstPageShown } from '@/app/router';
import { prefetchFirstScreen } from '@/app/first-screen-loaders';
import { signedInPerson, signedInThisLoad } from '@/lib/offline-writes';

// Who is signed in is asked at once, while the tablet's stored cache is restored and the page's code
// loads; the pages' loaders then find the answer (or the request under way) instead of starting it.
if (window.location.pathname !== '/sign-in') signedInPerson().catch(() => undefined); // a loader asks again and shows the error
prefetchFirstScreen(window.location);

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <AppProvider />
  </StrictMode>,
);

// The app shell's service worker (production builds; a no-op under the dev server), once someone is
// signed in (see signedInThisLoad) and the first page is on screen: its precache (the whole app, a
// hundred requests) would otherwise compete with that page for the network and the tablet's CPU.
// A new build takes over at once; the app moves to it at the next page change.
void signedInThisLoad
  .then(() => firstPageShown)
  .then(() => registerSW({ immediate: true, onNeedReload: reloadOnNextPage }));
