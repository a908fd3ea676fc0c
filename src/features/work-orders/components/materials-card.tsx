import type { MaterialsDto } from '@shared/schemas/work-order-plan';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { containers, volume } from '@/lib/format';

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[9rem_1fr] gap-3 py-1.5">
      <dt className="text-ink-soft">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}

/** What to bring, from the trade engine: cement, primer, quantities in containers, applicators, crew. */
export function MaterialsCard({ materials }: { materials: MaterialsDto }) {
  return (
    <Card title="Materials">
      {!materials.ok && (
        <div className="mb-3">
          <Notice tone="refusal" title="These materials cannot be planned">
            <ul className="list-disc pl-5">{materials.problems.map((p) => <li key={p}>{p}</li>)}</ul>
          </Notice>
        </div>
      )}
      <dl className="divide-y divide-ink/10 text-sm">
        <Row label="Pipe material">{materials.material ?? '—'}</Row>
        {materials.cement && (
          <>
            <Row label="Cement">{materials.cement.standard}{materials.cement.body && `, ${materials.cement.body} body`}</Row>
            <Row label="Primer">{materials.cement.primer ?? 'none called for'}</Row>
          </>
        )}
        {materials.quantities && (
          <>
            <Row label="Cement to bring">{containers(materials.quantities.cementContainers)} <span className="text-ink-soft">({volume(materials.quantities.cementQuarts)})</span></Row>
            <Row label="Primer to bring">{containers(materials.quantities.primerContainers)} <span className="text-ink-soft">({volume(materials.quantities.primerQuarts)})</span></Row>
          </>
        )}
        {materials.applicators.length > 0 && (
          <Row label="Applicators">
            <ul>{materials.applicators.map((a) => <li key={a.size}>{a.size}": {a.kind}, {a.widthIn} in wide{a.note && ` (${a.note})`}</li>)}</ul>
          </Row>
        )}
        {materials.crew && <Row label="Crew">{materials.crew.text}</Row>}
      </dl>
      {materials.sources.length > 0 && <p className="mt-2 text-xs text-ink-faint">Sources: {materials.sources.join('; ')}</p>}
    </Card>
  );
}
