import type { JointStep } from '@shared/schemas/joint-steps';

type Values = Record<string, unknown>;
const str = (v: unknown) => (v === undefined || v === null ? '' : String(v));
const yes = (v: unknown, words: string) => (v === true ? `${words} ✓` : null);
const UNIT: Record<string, string> = { F: '°F', C: '°C', in: 'in', mm: 'mm' };

/** A step's values in a line of words: as recorded by the server, or as waiting on this tablet. */
export function stepValuesText(step: JointStep, v: Values): string {
  const parts: (string | null)[] = (() => {
    switch (step) {
      case 'prep':
        return [yes(v.squareCut, 'square cut'), yes(v.deburred, 'deburred'), yes(v.chamfered, 'chamfered'), yes(v.cleanDry, 'clean and dry')];
      case 'dry-fit':
        return [
          `entered ${str(v.insertion)} ${UNIT[str(v.unit)] ?? str(v.unit)} dry`,
          v.unit === 'mm' && typeof v.insertionIn === 'number' ? `(${v.insertionIn} in)` : null,
          typeof v.socketDepthIn === 'number' ? `socket ${v.socketDepthIn} in deep` : null,
        ];
      case 'depth-marks':
        return [yes(v.insertionMark, 'insertion mark'), yes(v.checkMark, 'check mark')];
      case 'primer':
        return [`${str(v.standard)}, lot ${str(v.lot)}`, yes(v.softeningChecked, 'softening checked')];
      case 'cement':
        return [
          `${str(v.standard)}, lot ${str(v.lot)}, made ${str(v.manufacturedOn)}`,
          `${str(v.ambientTemperature)} ${UNIT[str(v.temperatureUnit)] ?? ''}`.trim(),
          `${str(v.relativeHumidity)} % RH`,
        ];
      case 'assembly':
        return [
          yes(v.assembledWet, 'assembled wet'),
          `held ${str(v.heldSeconds)} s`,
          v.joiningDeviceUsed === true ? 'joining device used' : null,
        ];
      case 'wipe':
        return [yes(v.beadWiped, 'bead wiped')];
    }
  })();
  const text = parts.filter(Boolean).join(' · ');
  return text.charAt(0).toUpperCase() + text.slice(1);
}
