import { useCallback } from 'react';
import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { api, ApiRequestError } from '@/lib/api-client';
import type { PlantSettings, PlantSettingsBody } from '@shared/schemas/plant-settings';

export const plantSettingsQueries = {
  all: () => ['plant-settings'] as const,
  current: () =>
    queryOptions({
      queryKey: [...plantSettingsQueries.all(), 'current'],
      queryFn: () => api.get<PlantSettings>('/api/plant-settings'),
    }),
};

/**
 * Saves the plant's choices. Nothing computed with the old ones needs dropping: a computation that
 * uses them (the calculator's server check) carries them in its query key, so new settings ask anew.
 */
export function useSetPlantSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PlantSettingsBody) => api.put<PlantSettings>('/api/plant-settings', body),
    onSuccess: (settings) => {
      qc.setQueryData(plantSettingsQueries.current().queryKey, settings);
      void qc.invalidateQueries({ queryKey: plantSettingsQueries.all() });
    },
    onError: (err) => {
      // Someone saved since this form opened: show what they chose, so the person can decide again.
      if (err instanceof ApiRequestError && err.status === 409) void qc.invalidateQueries({ queryKey: plantSettingsQueries.all() });
    },
  });
}

/** A stable callback that reads the plant settings again (they were changed elsewhere). */
export function useRefetchPlantSettings(): () => void {
  const qc = useQueryClient();
  return useCallback(() => void qc.invalidateQueries({ queryKey: plantSettingsQueries.all() }), [qc]);
}
