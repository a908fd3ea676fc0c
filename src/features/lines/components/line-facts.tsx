import type { LineDetailDto } from '@shared/schemas/lines';
import { cautionsFor, DEFERENCE, needsChemicalCaution } from '@shared/trade';
import { Notice } from '@/components/ui/notice';
import { formatDate, formatPressure, formatPressureBar, formatSize, formatTemperature, formatTemperatureC, formatWall } from '@/lib/format';

function Fact({ label, value, sub }: { label: string; value: React.ReactNode; sub?: string }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs font-semibold uppercase tracking-wide text-ink-faint">{label}</dt>
      <dd className="mt-0.5 text-base font-medium">
        {value}
        {sub && <span className="ml-1.5 text-sm font-normal text-ink-soft">({sub})</span>}
      </dd>
    </div>
  );
}

/** What the register knows about a line, with metric beside the inch/psi/°F values. */
export function LineFacts({ line }: { line: LineDetailDto }) {
  return (
    <dl className="grid grid-cols-2 gap-x-6 gap-y-4 sm:grid-cols-3">
      <Fact label="Area" value={line.area} />
      <Fact label="Service" value={line.service} />
      <Fact label="Material" value={line.material} />
      <Fact label="Nominal size" value={formatSize(line.nominalSize)} />
      <Fact label="Schedule / SDR" value={formatWall(line)} />
      <Fact label="Drawing" value={line.drawingRef ?? <span className="text-ink-faint">none recorded</span>} />
      <Fact label="Design pressure" value={formatPressure(line.designPressurePsi)} sub={formatPressureBar(line.designPressurePsi)} />
      <Fact label="Design temperature" value={formatTemperature(line.designTemperatureF)} sub={formatTemperatureC(line.designTemperatureF)} />
      <Fact label="Register updated" value={formatDate(line.updatedAt)} />
    </dl>
  );
}

/** The chemical-service caution, shown when the line's service does not read as plain water or air. */
export function ChemicalServiceCaution({ service }: { service: string }) {
  if (!needsChemicalCaution(service)) return null;
  const cautions = cautionsFor('chemical-service');
  return (
    <Notice tone="caution" title={`Before opening this line (${service})`}>
      <ul className="mt-1 space-y-1.5">
        {cautions.map((c) => (
          <li key={c.id}>
            <span className="font-semibold">{c.title}.</span> {c.text.replace(DEFERENCE, '').trim()}
          </li>
        ))}
      </ul>
      {/* Every caution ends with the same deference; said once here rather than after each. */}
      <p className="mt-1.5 text-ink-soft">{DEFERENCE}</p>
    </Notice>
  );
}
