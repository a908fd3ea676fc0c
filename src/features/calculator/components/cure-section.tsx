import type { JointPicture } from '@shared/trade';
import { degC, degF, duration, metricPressure, psi, type PressureUnit } from '@/lib/format';
import { Fact, Facts, Refused, Section, Source } from './facts';

export function CureSection({ picture: p, unit }: { picture: JointPicture; unit: PressureUnit }) {
  const { cure, spec } = p;
  const column = p.curePressureBasis === 'test'
    ? `Picked by the test pressure, ${psi(p.curePressurePsi)}: the first and highest pressure the joint sees.`
    : `Picked by the design pressure, ${psi(p.curePressurePsi)} (no test planned).`;
  return (
    <Section title="Set and cure" id="cure">
      {cure.ok ? (
        <Facts>
          <Fact term="Set: do not move the joint for" value={duration(cure.setMinutes)} />
          <Fact term="Cure: no pressure for" value={duration(cure.cureMinutes)} />
          <Fact term="Schedule" value={cure.schedule} note="The plant's published schedule." />
          <Fact term="Temperature band" value={cure.temperatureBand} note={`Lowest expected during the cure: ${degF(spec.cureTemperatureF)} (${degC(spec.cureTemperatureF)}). On a band edge, the colder band.`} />
          <Fact term="Size band" value={cure.sizeBand} />
          <Fact term="Pressure band" value={cure.pressureBand} metric={metricPressure(p.curePressurePsi, unit)} note={column} />
          <Fact
            term="Humidity"
            value={cure.humidityAdjusted ? '+50 % set and cure' : 'No adjustment'}
            note={cure.humidityAdjusted ? `${spec.relativeHumidity} % RH is above 60 %: the times above include 50 % more.` : `${spec.relativeHumidity} % RH is 60 % or less.`}
          />
        </Facts>
      ) : (
        <>
          <p className="mb-2 text-base font-semibold">No published set or cure time</p>
          <Refused section="Cure" reason={cure.reason} />
        </>
      )}
      {cure.ok && <Source of={[cure.source]} />}
    </Section>
  );
}
