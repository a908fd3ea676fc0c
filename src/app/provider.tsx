import { useState } from 'react';
import { onlineManager, useIsRestoring } from '@tanstack/react-query';
import { PersistQueryClientProvider } from '@tanstack/react-query-persist-client';
import { RouterProvider } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { tabletPersistOptions } from '@/lib/tablet-cache';
import { resumeWrites, tabletCacheUnreadable } from '@/lib/offline-writes';
import { appRouter } from '@/app/router';

/**
 * Whether the first page must wait for the tablet's stored cache. The register does not when online:
 * nothing it shows is kept (the kept answers are the shift's, the joints' and who is signed in, and the
 * sign-in check asks the server, or waits for the cache when the server cannot be reached: see
 * signedInPerson). Opening the IndexedDB store of a fresh browser held its first screen 0.1–0.4 s.
 */
const firstPageWaitsForCache = () => !(window.location.pathname === '/lines' && onlineManager.isOnline());

/**
 * The router is made once the tablet's stored cache is back (but see firstPageWaitsForCache): its
 * loaders then find the shift and the joints the tablet kept, and a page opens offline. Restoring
 * reads IndexedDB (a few ms on a warm tablet).
 */
function RoutesAfterRestore() {
  const restoring = useIsRestoring();
  const [waits] = useState(firstPageWaitsForCache);
  return restoring && waits ? null : <RouterProvider router={appRouter()} />;
}

export function AppProvider() {
  return (
    <PersistQueryClientProvider client={queryClient} persistOptions={tabletPersistOptions} onSuccess={resumeWrites} onError={tabletCacheUnreadable}>
      <RoutesAfterRestore />
    </PersistQueryClientProvider>
  );
}
