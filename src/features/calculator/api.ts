import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { JointPicture, JointSpecInput } from '@shared/trade';
import type { PlantSettings, PlantSettingsBody } from '@shared/schemas/plant-settings';

export const calcQueries = {
  all: () => ['calc'] as const,
  /** The server's picture of one joint: a pure computation, so a POST that can be cached like a read. */
  joint: (spec: JointSpecInput) =>
    queryOptions({
      queryKey: [...calcQueries.all(), 'joint', spec],
      queryFn: () => api.post<JointPicture>('/api/calc/joint', spec),
      staleTime: 5 * 60_000,
    }),
};

export const plantSettingsQueries = {
  all: () => ['plant-settings'] as const,
  current: () =>
    queryOptions({
      queryKey: [...plantSettingsQueries.all(), 'current'],
      queryFn: () => api.get<PlantSettings>('/api/plant-settings'),
    }),
};

export function useSetPlantSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PlantSettingsBody) => api.put<PlantSettings>('/api/plant-settings', body),
    onSuccess: (settings) => {
      qc.setQueryData(plantSettingsQueries.current().queryKey, settings);
      void qc.invalidateQueries({ queryKey: plantSettingsQueries.all() });
      void qc.invalidateQueries({ queryKey: calcQueries.all() });
    },
  });
}
