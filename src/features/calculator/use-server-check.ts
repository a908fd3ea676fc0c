import { useEffect, useRef, useState } from 'react';
import { keepPreviousData, useQuery, useQueryClient } from '@tanstack/react-query';
import type { JointPicture, JointSpecInput } from '@shared/trade';
import { calcQueries, plantSettingsQueries } from './api';
import { differingSections, pictureFor, stableJson } from './preview';

export type ServerCheck =
  | { state: 'idle' | 'checking' }
  | { state: 'agrees' }
  | { state: 'disagrees'; server: JointPicture; sections: string[] }
  | { state: 'error'; message: string };

function useDebounced<T>(value: T, ms: number): T {
  const [held, setHeld] = useState(value);
  const key = stableJson(value);
  const latest = useRef(value);
  latest.current = value;
  useEffect(() => {
    const t = setTimeout(() => setHeld(latest.current), ms);
    return () => clearTimeout(t);
  }, [key, ms]);
  return held;
}

/**
 * Asks the server for the same picture, a moment after typing stops, and says whether it agrees
 * with the preview. The server is the authority: when they differ, its answer is what to show.
 */
export function useServerCheck(spec: JointSpecInput | null): ServerCheck {
  const qc = useQueryClient();
  const asked = useDebounced(spec, 400);
  const query = useQuery({ ...calcQueries.joint(asked ?? ({} as JointSpecInput)), enabled: asked !== null, placeholderData: keepPreviousData, retry: 1 });
  const settled = spec !== null && asked !== null && stableJson(spec) === stableJson(asked) && !query.isPlaceholderData;
  const server = settled ? query.data : undefined;
  const sections = server && asked ? differingSections(pictureFor(asked) ?? ({} as JointPicture), server) : [];
  const plantChanged = server !== undefined && asked !== null && (server.spec.cureScheduleId !== asked.cureScheduleId || server.spec.testCap !== asked.testCap);

  // the server used other plant settings than this page holds: an admin changed them; fetch them again
  useEffect(() => {
    if (plantChanged) void qc.invalidateQueries({ queryKey: plantSettingsQueries.all() });
  }, [plantChanged, qc]);

  if (spec === null) return { state: 'idle' };
  if (settled && query.isError) return { state: 'error', message: query.error.message };
  if (!server || query.isFetching) return { state: 'checking' };
  return sections.length === 0 ? { state: 'agrees' } : { state: 'disagrees', server, sections };
}
