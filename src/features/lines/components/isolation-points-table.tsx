import type { IsolationPointDto } from '@shared/schemas/lines';

const KIND_LABELS: Record<IsolationPointDto['kind'], string> = { valve: 'Valve', blind: 'Blind', disconnect: 'Disconnect' };

export function IsolationPointsTable({ points }: { points: IsolationPointDto[] }) {
  if (points.length === 0) {
    return <p className="text-sm text-ink-soft">No isolation points are recorded for this line. A planner adds them with an isolation-point import.</p>;
  }
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <thead className="whitespace-nowrap border-b border-ink/10 text-[13px] font-semibold text-ink-soft">
          <tr>
            <th scope="col" className="py-2 pr-3">Tag</th>
            <th scope="col" className="px-3 py-2">Kind</th>
            <th scope="col" className="px-3 py-2">Normal position</th>
            <th scope="col" className="py-2 pl-3">Notes</th>
          </tr>
        </thead>
        <tbody>
          {points.map((p) => (
            <tr key={p.id} className="border-b border-ink/5 last:border-0">
              <td className="h-11 whitespace-nowrap py-2 pr-3 font-semibold">{p.tag}</td>
              <td className="px-3 py-2">{KIND_LABELS[p.kind]}</td>
              <td className="px-3 py-2">{p.normalPosition}</td>
              <td className="py-2 pl-3 text-ink-soft">{p.notes ?? '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
