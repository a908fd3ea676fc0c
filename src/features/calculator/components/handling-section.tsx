import type { JointPicture } from '@shared/trade';
import { inches, mm } from '@/lib/format';
import { Fact, Facts, Section, Source } from './facts';

const KIND = { dauber: 'Dauber', swab: 'Swab', 'swab-or-roller': 'Swab or roller' } as const;

export function HandlingSection({ picture: p }: { picture: JointPicture }) {
  const { applicator: a, crew, hold } = p;
  return (
    <Section title="Making the joint" id="handling">
      <Facts>
        {a.ok && <Fact term="Applicator" value={`${KIND[a.kind]}, about ${inches(a.widthIn)} wide`} metric={mm(a.widthIn)} note={a.note ?? 'About half the pipe diameter.'} />}
        {crew.ok && (
          <>
            <Fact term="Crew" value={`${crew.crew} ${crew.crew === 1 ? 'fitter' : 'people'}`} note={crew.text} />
            <Fact term="Mechanical joining device" value={crew.mechanicalJoiningDevice ? 'Needed' : 'Not needed'} />
          </>
        )}
        {hold.ok && <Fact term="Hold the assembled joint" value={`at least ${hold.seconds} s`} note="Longer in the cold; then wipe off the bead." />}
      </Facts>
      <Source of={[a.ok ? a.source : null, crew.ok ? crew.source : null, hold.ok ? hold.source : null]} />
    </Section>
  );
}
