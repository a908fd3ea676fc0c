import type { ReactNode } from 'react';
import type { PressureTestDto } from '@shared/schemas/release';
import { duration, formatDateTime, formatPressure } from '@/lib/format';

function Result({ result }: { result: PressureTestDto['result'] }) {
  return result === 'passed' ? (
    <span className="rounded border border-tide bg-tide-light px-1.5 text-xs font-semibold uppercase leading-5 tracking-wide text-ink">Passed</span>
  ) : (
    <span className="rounded border border-refuse/50 bg-refuse-light px-1.5 text-xs font-semibold uppercase leading-5 tracking-wide text-ink">Failed</span>
  );
}

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="sm:flex sm:gap-2">
      <dt className="shrink-0 text-ink-soft sm:w-32">{label}</dt>
      <dd className="min-w-0 break-words">{children}</dd>
    </div>
  );
}

/** The tests recorded on the order, oldest first: the record ASME B31.3 345.2.7 asks for, and who witnessed it. */
export function PressureTestList({ tests }: { tests: readonly PressureTestDto[] }) {
  return (
    <ol className="space-y-3">
      {tests.map((t, i) => (
        <li key={t.id} className="rounded-lg border border-ink/10 p-3 text-sm">
          <p className="mb-2 flex flex-wrap items-center gap-2">
            <Result result={t.result} />
            <span className="font-semibold">Test {i + 1}</span>
            <span className="text-ink-soft">· {formatDateTime(t.startedAt)} – {formatDateTime(t.endedAt)}</span>
          </p>
          <dl className="space-y-0.5">
            <Row label="Pressure">{formatPressure(t.testPressurePsi)} with {t.medium}</Row>
            <Row label="Readings">{formatPressure(t.startReadingPsi)} at the start → {formatPressure(t.endReadingPsi)} at the end</Row>
            <Row label="Held">{duration(t.holdMinutes)}</Row>
            <Row label="Gauge">{t.gauge}</Row>
            <Row label="Piping">{t.pipingIdentified}</Row>
            {t.leakingJoints.length > 0 && <Row label="Leaked">{t.leakingJoints.map((j) => j.label).join(', ')} (cut out for redo)</Row>}
            <Row label="Witness">{t.witness.name || 'unknown'} · recorded {formatDateTime(t.recordedAt)}</Row>
            <Row label="Examiner">{t.examiner}</Row>
            {t.notes && <Row label="Notes">{t.notes}</Row>}
          </dl>
        </li>
      ))}
    </ol>
  );
}
