// Pure readings of a work order's lock board (LockoutDto): where the signed-in person still needs a
// lock, who holds locks for a handover, what the verification form starts from. No I/O, no clock.

import type { Handover, LocksApply, LockoutDto, LockDto } from '@shared/schemas/lockout';
import type { WorkOrderState } from '@shared/schemas/work-orders';

export type LockoutPoint = LockoutDto['points'][number];

/** The board belongs to an order once its plan is booked; a draft has no isolation yet, a cancelled one none left. */
export const showsLockBoard = (state: WorkOrderState): boolean => state !== 'draft' && state !== 'cancelled';

// The server's rules, mirrored (server/services/lockout/protection.ts and verification.ts): the page
// offers an action only where the server would take it; the server decides.
/** Locks go on, the box is set up and shifts hand over while the order's section may be locked out by it. */
const LOCKABLE: readonly string[] = ['planned', 'isolated', 'in-work', 'curing', 'testing'];
export const locksMayGoOn = (state: string): boolean => LOCKABLE.includes(state);
/** People may be working on the opened section: no point may be left without a lock. */
const SECTION_OPEN: readonly string[] = ['isolated', 'in-work', 'curing'];
export const sectionOpen = (state: string): boolean => SECTION_OPEN.includes(state);
/** Zero energy is verified before work starts, and again after the locks were off for a test. */
const VERIFIABLE: readonly string[] = ['planned', 'in-work', 'testing'];
export const mayBeVerified = (board: Pick<LockoutDto, 'state' | 'verification'>): boolean => !board.verification && VERIFIABLE.includes(board.state);

/** Positions compare as words: "Closed " is "closed". */
export const samePosition = (a: string, b: string): boolean => a.trim().toLowerCase() === b.trim().toLowerCase();

/** Somewhere one lock goes: a point locked point by point, or the order's group lock box. */
export type LockTargetRow = { key: string; label: string; target: { entryId: string } | { lockBoxId: string } };

const myIds = (board: LockoutDto) => new Set(board.myLocks.map((l) => l.id));

/** Whether a lock (on a point or on the box) is one of the signed-in person's. */
export const isMine = (board: LockoutDto, lock: LockDto): boolean => myIds(board).has(lock.id);

/** "HV-20013", "lock box LB-1": where a lock is (or was), in words. */
export function placeOf(board: LockoutDto, lock: Pick<LockDto, 'entryId' | 'lockBoxId'>): string {
  if (lock.lockBoxId) return board.lockBox?.id === lock.lockBoxId ? `lock box ${board.lockBox.label}` : 'the lock box';
  return board.points.find((p) => p.entryId === lock.entryId)?.tag ?? 'a point no longer in the plan';
}

/**
 * Where the signed-in person has no lock yet: the box (when there is one) and every point whose key
 * is not in the box. A point in the box is protected by the locks on the box, not by its own.
 */
export function targetsNeedingMyLock(board: LockoutDto): LockTargetRow[] {
  const mine = myIds(board);
  const rows: LockTargetRow[] = [];
  if (board.lockBox && !board.lockBox.locks.some((l) => mine.has(l.id))) {
    rows.push({ key: `box:${board.lockBox.id}`, label: `Lock box ${board.lockBox.label}`, target: { lockBoxId: board.lockBox.id } });
  }
  for (const p of board.points) {
    if (p.lockBoxId || p.locks.some((l) => mine.has(l.id))) continue;
    rows.push({ key: `point:${p.entryId}`, label: p.tag, target: { entryId: p.entryId } });
  }
  return rows;
}

const norm = (n: string) => n.trim().toLowerCase();

/**
 * Lock numbers typed twice in one form, or already on the order: one physical lock hangs in one
 * place, and its number says whose it is. Returned as typed (trimmed), each once.
 */
export function repeatedNumbers(typed: readonly string[], alreadyOn: readonly string[] = []): string[] {
  const seen = new Set(alreadyOn.map(norm));
  const out = new Map<string, string>();
  for (const raw of typed) {
    const n = norm(raw);
    if (!n) continue;
    if (seen.has(n)) out.set(n, raw.trim());
    seen.add(n);
  }
  return [...out.values()];
}

/** The body of "apply my locks": each target given a number, in the form's order. */
export function toLocksApply(rows: readonly LockTargetRow[], numbers: Readonly<Record<string, string>>): LocksApply {
  const locks = rows.flatMap((r) => {
    const lockNumber = numbers[r.key]?.trim();
    return lockNumber ? [{ ...r.target, lockNumber }] : [];
  });
  return { locks };
}

/** Every lock on right now, on the points and on the box. */
export function locksOn(board: LockoutDto): LockDto[] {
  return [...board.points.flatMap((p) => p.locks), ...(board.lockBox?.locks ?? [])];
}

export type LockHolder = { person: LockDto['person']; locks: LockDto[] };

/** The people with a lock on now, each with their locks, by name; the signed-in person left out. */
export function lockHolders(board: LockoutDto, exceptPersonId?: string): LockHolder[] {
  const byPerson = new Map<string, LockHolder>();
  for (const lock of locksOn(board)) {
    if (lock.person.id === exceptPersonId) continue;
    const holder = byPerson.get(lock.person.id) ?? { person: lock.person, locks: [] };
    holder.locks.push(lock);
    byPerson.set(lock.person.id, holder);
  }
  return [...byPerson.values()].sort((a, b) => a.person.name.localeCompare(b.person.name));
}

/** The body of a handover: one new number for each of the off-going person's locks. */
export function toHandover(fromPersonId: string, locks: readonly LockDto[], numbers: Readonly<Record<string, string>>): Handover {
  return { fromPersonId, locks: locks.map((l) => ({ replacesLockId: l.id, lockNumber: (numbers[l.id] ?? '').trim() })) };
}

/** The verification form's positions: what was found last time, else the required position. */
export function positionDefaults(board: LockoutDto): Record<string, string> {
  return Object.fromEntries(board.points.map((p) => [p.entryId, p.positionFound ?? p.requiredPosition]));
}

export const unprotectedPoints = (board: LockoutDto): LockoutPoint[] => board.points.filter((p) => !p.protected);

/** The lock a handover took over from, wherever it is now (on, or removed). */
export function handedOverFrom(board: LockoutDto, lock: LockDto): LockDto | undefined {
  if (!lock.handedOverFromLockId) return undefined;
  return [...locksOn(board), ...board.removedLocks].find((l) => l.id === lock.handedOverFromLockId);
}

const pad = (n: number) => String(n).padStart(2, '0');

/** A moment as a `datetime-local` value in the viewer's zone ("2027-03-01T06:00"). */
export function toLocalInput(d: Date): string {
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** A `datetime-local` value (local wall-clock time) as an ISO instant; null when empty or not a time. */
export function localInputToIso(value: string): string | null {
  if (!value) return null;
  const d = new Date(value);
  return Number.isNaN(d.getTime()) ? null : d.toISOString();
}
