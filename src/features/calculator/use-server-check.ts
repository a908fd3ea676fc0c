import { useEffect } from 'react';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { JointPicture, JointSpecInput } from '@shared/trade';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { calcQueries } from './api';
import { differingSections, pictureFor, stableJson } from './preview';

export type ServerCheck =
  | { state: 'idle' | 'checking' }
  | { state: 'agrees' }
  | { state: 'disagrees'; server: JointPicture; sections: string[] }
  | { state: 'error'; message: string };

/**
 * Asks the server for the same picture, a moment after typing stops, and says whether it agrees
 * with the preview. The server is the authority: when they differ, its answer is what to show.
 * When the server used other plant settings than `spec` carries, `onPlantChanged` is called (keep
 * it stable), so the page can read the plant's settings again.
 */
export function useServerCheck(spec: JointSpecInput | null, onPlantChanged: () => void): ServerCheck {
  const asked = useDebouncedValue(spec, 400, stableJson(spec));
  const query = useQuery({ ...calcQueries.joint(asked ?? ({} as JointSpecInput)), enabled: asked !== null, placeholderData: keepPreviousData, retry: 1 });
  const settled = spec !== null && asked !== null && stableJson(spec) === stableJson(asked) && !query.isPlaceholderData;
  const server = settled ? query.data : undefined;
  const sections = server && asked ? differingSections(pictureFor(asked) ?? ({} as JointPicture), server) : [];
  const plantChanged = server !== undefined && asked !== null && (server.spec.cureScheduleId !== asked.cureScheduleId || server.spec.testCap !== asked.testCap);

  // the server used other plant settings than this page holds: an admin changed them
  useEffect(() => {
    if (plantChanged) onPlantChanged();
  }, [plantChanged, onPlantChanged]);

  if (spec === null) return { state: 'idle' };
  if (settled && query.isError) return { state: 'error', message: query.error.message };
  if (!server || query.isFetching) return { state: 'checking' };
  return sections.length === 0 ? { state: 'agrees' } : { state: 'disagrees', server, sections };
}
