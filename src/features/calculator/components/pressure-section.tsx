import type { JointPicture } from '@shared/trade';
import { TEST_CAP_LABELS } from '@shared/schemas/plant-settings';
import { degC, degF, duration, metricPressure, psi, type PressureUnit } from '@/lib/format';
import { Fact, Facts, Refused, Section, Source } from './facts';

export function PressureSection({ picture: p, unit }: { picture: JointPicture; unit: PressureUnit }) {
  const { rating, test, spec } = p;
  return (
    <Section title="Rating and pressure test" id="pressure">
      <Facts>
        {rating.ok ? (
          <Fact
            term={`Rating at ${degF(spec.designTemperatureF)}`}
            value={psi(rating.psi)}
            metric={`${metricPressure(rating.psi, unit)} at ${degC(spec.designTemperatureF)}`}
            note={`${psi(rating.ratedPsiAt73)} at 73 °F × ${rating.factor.toFixed(2)} (factor of the ${rating.factorRowF} °F row)`}
          />
        ) : (
          <Fact term="Rating" value="No rating" note={rating.reason} />
        )}
        {test === null && <Fact term="Pressure test" value="None planned" note="Not pressure service and no test pressure given." />}
        {test?.ok && (
          <>
            <Fact term="Test pressure" value={psi(test.testPsi)} metric={metricPressure(test.testPsi, unit)} note={spec.testPressurePsi === undefined ? '1.5 × design pressure, rounded up.' : 'As entered; not below 1.5 × design.'} />
            <Fact term="Hold the test at least" value={duration(test.minHoldMinutes)} />
            <Fact term="Test cap" value={psi(test.capPsi)} metric={metricPressure(test.capPsi, unit)} note={`${TEST_CAP_LABELS[test.cap]} (plant setting).`} />
            <Fact term="Test medium" value="Water" note="Hydrostatic, vented of air." />
          </>
        )}
      </Facts>
      {test && !test.ok && <Refused section="Test" reason={test.reason} />}
      <Source of={[rating.ok ? rating.source : null, test?.ok ? test.source : null]} />
    </Section>
  );
}
