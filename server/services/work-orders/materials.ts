// The materials an order needs, from the trade engine: one cement for the order's one material,
// its body for the largest joint, cement and primer rounded up to containers, applicators per
// size, and the crew and joining device for the largest joint. Pure: the facts come in.

import {
  applicatorSize, CEMENT_FOR_MATERIAL, cementCheck, cementQuantities, crewAndTools, nominalSizeLabel, parseNominalSize, SOURCES, type Material,
} from '@shared/trade';
import type { MaterialsDto } from '@shared/schemas/work-order-plan';

export interface MaterialsLine {
  lineNumber: string;
  material: Material;
  nominalSize: string;
  designPressurePsi: number;
}

/** A joint as the engine sees it: the size it is made at. */
export interface MaterialsJoint {
  jointSize: string;
}

const bySize = (a: string, b: string) => (parseNominalSize(a) ?? 0) - (parseNominalSize(b) ?? 0);

/** The largest of the sizes, or null for none. */
export function largestSize(sizes: readonly string[]): string | null {
  const sorted = [...new Set(sizes)].sort(bySize);
  return sorted[sorted.length - 1] ?? null;
}

/** Every joint of an order shares one cement: the one for the first line's material. Another material is the engine's refusal. */
function cementProblems(lines: readonly MaterialsLine[], largest: string): { standard: string | null; problems: string[] } {
  const first = lines[0];
  if (!first) return { standard: null, problems: ['The order has no lines, so there is no material to choose a cement for.'] };
  const standard = `ASTM ${CEMENT_FOR_MATERIAL[first.material]}`;
  const problems: string[] = [];
  for (const line of lines) {
    const check = cementCheck({ pipeMaterial: line.material, cementStandard: standard, nominalSize: largest, pressureService: line.designPressurePsi > 0 });
    for (const p of check.problems) problems.push(`Line ${line.lineNumber} (${line.material}): ${p}`);
  }
  if (problems.length) problems.push('One order joins one material with one cement: split the order by material.');
  return { standard, problems };
}

export function materialsFor(lines: readonly MaterialsLine[], joints: readonly MaterialsJoint[]): MaterialsDto {
  const sizes = joints.length ? joints.map((j) => j.jointSize) : lines.map((l) => l.nominalSize);
  const largest = largestSize(sizes);
  const empty: MaterialsDto = { ok: false, problems: [], material: null, cement: null, quantities: null, applicators: [], crew: null, sources: [] };
  if (!largest) return { ...empty, problems: ['The order has no lines, so there is no material to choose a cement for.'] };
  const { standard, problems } = cementProblems(lines, largest);
  const check = cementCheck({ pipeMaterial: lines[0]!.material, cementStandard: standard ?? '', nominalSize: largest, pressureService: true });
  const counts = new Map<string, number>();
  for (const j of joints) counts.set(j.jointSize, (counts.get(j.jointSize) ?? 0) + 1);
  const quantities = cementQuantities([...counts].map(([nominalSize, count]) => ({ nominalSize, count })));
  if (!quantities.ok) problems.push(`Quantities: ${quantities.reason}`);
  const crew = crewAndTools(largest);
  const applicators = [...new Set(sizes)].sort(bySize).flatMap((size) => {
    const a = applicatorSize(size);
    return a.ok ? [{ size: nominalSizeLabel(parseNominalSize(size) ?? 0) ?? size, widthIn: a.widthIn, kind: a.kind, note: a.note ?? null }] : [];
  });
  return {
    ok: problems.length === 0,
    problems,
    material: lines[0]!.material,
    cement: standard ? { standard, body: check.requiredBody ?? null, primer: check.primerStandard ?? null } : null,
    quantities: quantities.ok
      ? { cementQuarts: quantities.cementQuarts, primerQuarts: quantities.primerQuarts, cementContainers: quantities.cementContainers, primerContainers: quantities.primerContainers }
      : null,
    applicators,
    crew: crew.ok ? { size: largest, crew: crew.crew, mechanicalJoiningDevice: crew.mechanicalJoiningDevice, text: crew.text } : null,
    sources: [check.source, ...(quantities.ok ? [quantities.source] : []), SOURCES.applicator, SOURCES.crew],
  };
}
