import { useEffect, useState } from 'react';
import type { PhotoDto } from '@shared/schemas/joint-steps';
import { formatDateTime } from '@/lib/format';

/** Recorded photos: each opens full size in a new tab. */
export function PhotoThumbs({ photos }: { photos: readonly PhotoDto[] }) {
  if (!photos.length) return null;
  return (
    <ul className="flex flex-wrap gap-2">
      {photos.map((p) => (
        <li key={p.id}>
          <a href={p.url} target="_blank" rel="noreferrer" className="block rounded-lg border border-ink/15 hover:border-tide">
            <img src={p.url} alt={`Photo by ${p.takenBy.name}, ${formatDateTime(p.takenAt)}`} width={96} height={96} loading="lazy" className="h-24 w-24 rounded-lg object-cover" />
          </a>
        </li>
      ))}
    </ul>
  );
}

/** A photo still on this tablet (taken, or waiting to send), shown from its Blob. */
export function LocalThumb({ blob, alt }: { blob: Blob; alt: string }) {
  const [url, setUrl] = useState<string | null>(null);
  useEffect(() => {
    const made = URL.createObjectURL(blob);
    setUrl(made);
    return () => URL.revokeObjectURL(made);
  }, [blob]);
  return url ? <img src={url} alt={alt} width={96} height={96} className="h-24 w-24 rounded-lg border border-ink/15 object-cover" /> : <span className="block h-24 w-24 rounded-lg bg-paper-sunk" />;
}
