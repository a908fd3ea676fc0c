// The hydrostatic test form as typed (strings, ticks, local times) and the record the server takes
// (shared/schemas/release.ts), plus what the order's page shows after a release. Pure: no I/O, no clock.

import { pressureTestBodySchema, type PressureTestBody } from '@shared/schemas/release';
import type { WorkOrderDto } from '@shared/schemas/work-orders';

export interface TestForm {
  toolsClear: boolean;
  peopleClear: boolean;
  medium: string;
  testPressurePsi: string;
  gauge: string;
  /** `datetime-local` values, in the browser's time zone. */
  startedAt: string;
  startReadingPsi: string;
  endedAt: string;
  endReadingPsi: string;
  result: 'passed' | 'failed' | '';
  leakingJointIds: string[];
  pipingIdentified: string;
  examiner: string;
  notes: string;
}

type OrderFacts = Pick<WorkOrderDto, 'lines' | 'testPressure'>;

/** Water, the order's test pressure, and the order's lines as the piping tested; the rest the witness fills in. */
export function initialTestForm(order: OrderFacts): TestForm {
  return {
    toolsClear: false,
    peopleClear: false,
    medium: 'water',
    testPressurePsi: order.testPressure.testPsi === null ? '' : String(order.testPressure.testPsi),
    gauge: '',
    startedAt: '',
    startReadingPsi: '',
    endedAt: '',
    endReadingPsi: '',
    result: '',
    leakingJointIds: [],
    pipingIdentified: order.lines.map((l) => l.lineNumber).join(', '),
    examiner: '',
    notes: '',
  };
}

/** A local `datetime-local` value as an instant with its offset (UTC), or undefined when it is not a time. */
export function toInstant(local: string): string | undefined {
  if (!local) return undefined;
  const d = new Date(local);
  return Number.isNaN(d.getTime()) ? undefined : d.toISOString();
}

/** A typed number, or undefined for an empty or unreadable field (so the schema names it, rather than reading 0). */
export function toNumber(typed: string): number | undefined {
  const s = typed.trim();
  if (!s) return undefined;
  const n = Number(s);
  return Number.isFinite(n) ? n : undefined;
}

/** Whole minutes between the two typed times, as the server counts the hold; null until both are times. */
export function heldMinutes(startedAt: string, endedAt: string): number | null {
  const a = toInstant(startedAt);
  const b = toInstant(endedAt);
  if (!a || !b) return null;
  return Math.floor((Date.parse(b) - Date.parse(a)) / 60_000);
}

/** The body the form sends, checked with the same schema the route uses; each problem keyed by its field. */
export function testBodyFrom(form: TestForm): { body: PressureTestBody; problems: null } | { body: null; problems: Record<string, string[]> } {
  const parsed = pressureTestBodySchema.safeParse({
    toolsClear: form.toolsClear,
    peopleClear: form.peopleClear,
    medium: form.medium,
    testPressurePsi: toNumber(form.testPressurePsi),
    gauge: form.gauge,
    startedAt: toInstant(form.startedAt),
    startReadingPsi: toNumber(form.startReadingPsi),
    endedAt: toInstant(form.endedAt),
    endReadingPsi: toNumber(form.endReadingPsi),
    result: form.result || undefined,
    leakingJointIds: form.result === 'failed' ? form.leakingJointIds : [],
    pipingIdentified: form.pipingIdentified,
    examiner: form.examiner,
    notes: form.notes.trim() ? form.notes : undefined,
  });
  if (parsed.success) return { body: parsed.data, problems: null };
  const problems: Record<string, string[]> = {};
  for (const issue of parsed.error.issues) {
    const key = String(issue.path[0] ?? 'form');
    (problems[key] ??= []).push(issue.message);
  }
  return { body: null, problems };
}

/** The joints a leak may be named on: those still in the line (not already cut out for redo). */
export const leakCandidates = (tasks: WorkOrderDto['jointTasks']) => tasks.filter((t) => !t.redone);

/** Who released the order and when, from its history (the last release entry); null before a release. */
export function releaseRecord(history: WorkOrderDto['history']): { by: string; at: string; notes: string | null } | null {
  const entry = [...history].reverse().find((h) => h.action === 'order-released');
  if (!entry) return null;
  const after = (entry.after && typeof entry.after === 'object' ? entry.after : {}) as Record<string, unknown>;
  const by = entry.actor?.name ?? (typeof after.releasedBy === 'string' ? after.releasedBy : 'operations');
  return { by, at: entry.at, notes: typeof after.notes === 'string' ? after.notes : null };
}
