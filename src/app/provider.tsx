import { useIsRestoring } from '@tanstack/react-query';
import { PersistQueryClientProvider } from '@tanstack/react-query-persist-client';
import { RouterProvider } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { tabletPersistOptions } from '@/lib/tablet-cache';
import { resumeWrites } from '@/lib/offline-writes';
import { appRouter } from '@/app/router';

/**
 * The router is made once the tablet's stored cache is back: its loaders then find the shift and
 * the joints the tablet kept, and a page opens offline. Restoring reads IndexedDB (a few ms).
 */
function RoutesAfterRestore() {
  const restoring = useIsRestoring();
  return restoring ? null : <RouterProvider router={appRouter()} />;
}

export function AppProvider() {
  return (
    <PersistQueryClientProvider client={queryClient} persistOptions={tabletPersistOptions} onSuccess={resumeWrites}>
      <RoutesAfterRestore />
    </PersistQueryClientProvider>
  );
}
