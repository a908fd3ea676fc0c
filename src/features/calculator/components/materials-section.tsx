import type { JointPicture } from '@shared/trade';
import { containers, volume } from '@/lib/format';
import { Fact, Facts, Refused, Section, Source } from './facts';

const BODY_LABEL = { regular: 'Regular body', medium: 'Medium body', heavy: 'Heavy body' } as const;

export function MaterialsSection({ picture: p }: { picture: JointPicture }) {
  const { cement, quantities: q, spec } = p;
  return (
    <Section title="Cement, primer and quantities" id="materials">
      <Facts>
        <Fact term="Cement standard" value={cement.requiredStandard ?? '—'} note={spec.cementStandard ? `Entered: ${spec.cementStandard}.` : 'The cement this pipe calls for.'} />
        {cement.requiredBody && <Fact term="Cement body" value={BODY_LABEL[cement.requiredBody]} note="Or heavier." />}
        <Fact term="Primer" value={cement.primerStandard ?? 'None listed'} note={cement.primerStandard ? 'Two-step joint: primer, then cement.' : 'ABS is joined without primer.'} />
        {q.ok ? (
          <>
            <Fact term="Cement for one joint" value={volume(q.cementQuarts)} note={`Smallest container: ${containers(q.cementContainers)}.`} />
            <Fact term="Primer for one joint" value={volume(q.primerQuarts)} note={`Smallest container: ${containers(q.primerContainers)}.`} />
          </>
        ) : (
          <Fact term="Quantities" value="Not in the table" note={q.reason} />
        )}
      </Facts>
      {cement.problems.map((problem) => (
        <div key={problem} className="mt-2">
          <Refused section="Cement" reason={problem} />
        </div>
      ))}
      <Source of={[cement.source, q.ok ? q.source : null]} />
    </Section>
  );
}
