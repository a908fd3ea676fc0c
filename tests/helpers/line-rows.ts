import { randomUUID } from 'node:crypto';
import type { InferCreationAttributes } from 'sequelize';
import { Line } from '@server/db/models/line';
import { IsolationPoint } from '@server/db/models/isolation-point';
import { parseNominalSize } from '@shared/trade';
import type { IsolationKind } from '@shared/schemas/lines';

type LineFields = Partial<Omit<InferCreationAttributes<Line>, 'nominalSizeIn'>>;

/** A prefix no other test (or test file, on the shared database) uses for its areas and line numbers. */
export const uniquePrefix = (word: string) => `${word}-${randomUUID().slice(0, 8)}`;

/** Lines in the register as the importer would leave them; the size's inches follow from its text. */
export async function makeLines(prefix: string, lines: LineFields[]): Promise<Line[]> {
  return Line.bulkCreate(
    lines.map((l, i) => {
      const nominalSize = l.nominalSize ?? '2';
      return {
        lineNumber: `${prefix}-${String(i + 1).padStart(3, '0')}`,
        area: `${prefix} area`,
        service: 'Caustic 20%',
        material: 'PVC' as const,
        schedule: l.sdr ? null : '80',
        sdr: null,
        designPressurePsi: 100,
        designTemperatureF: 73,
        drawingRef: null,
        notes: null,
        ...l,
        nominalSize,
        nominalSizeIn: parseNominalSize(nominalSize)!,
      };
    }),
  );
}

export function makeIsolationPoint(line: Line, tag: string, kind: IsolationKind = 'valve') {
  return IsolationPoint.create({ lineId: line.id, tag, kind, normalPosition: kind === 'valve' ? 'open' : 'installed', notes: null });
}
