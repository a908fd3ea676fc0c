import { Link } from 'react-router-dom';
import type { OverlapDto } from '@shared/schemas/work-order-plan';
import { Notice } from '@/components/ui/notice';

/** Another order whose window overlaps this one's on the same line or isolation point. */
export function OverlapsNotice({ overlaps }: { overlaps: OverlapDto[] }) {
  if (!overlaps.length) return null;
  const by = new Map<string, { number: string; on: string[] }>();
  for (const o of overlaps) {
    const entry = by.get(o.orderId) ?? { number: o.number, on: [] };
    entry.on.push(`${o.on === 'line' ? 'line' : 'isolation point'} ${o.what}`);
    by.set(o.orderId, entry);
  }
  return (
    <Notice tone="caution" title={`The window overlaps ${by.size === 1 ? 'another order' : `${by.size} other orders`}`}>
      <ul>
        {[...by].map(([id, o]) => (
          <li key={id}>
            <Link to={`/work-orders/${id}`} className="font-semibold text-tide underline">{o.number}</Link> works at the same time on {o.on.join(' and ')}.
          </li>
        ))}
      </ul>
    </Notice>
  );
}
