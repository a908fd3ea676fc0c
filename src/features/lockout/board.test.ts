import { describe, expect, it } from 'vitest';
import type { LockDto, LockoutDto } from '@shared/schemas/lockout';
import {
  handedOverFrom, isMine, lockHolders, localInputToIso, locksMayGoOn, mayBeVerified, placeOf, positionDefaults, repeatedNumbers,
  samePosition, sectionOpen, showsLockBoard, targetsNeedingMyLock, toHandover, toLocalInput, toLocksApply, unprotectedPoints,
} from './board';

const ann = { id: 'p-ann', name: 'Ann Ortiz' };
const ben = { id: 'p-ben', name: 'Ben Wu' };

const lock = (id: string, person: LockDto['person'], where: { entryId?: string; lockBoxId?: string }, extra: Partial<LockDto> = {}): LockDto => ({
  id, lockNumber: id.toUpperCase(), person, entryId: where.entryId ?? null, lockBoxId: where.lockBoxId ?? null,
  appliedAt: '2027-03-01T06:00:00.000Z', handedOverFromLockId: null, removedAt: null, removedBy: null, removal: null, ...extra,
});
const point = (entryId: string, tag: string, extra: Partial<LockoutDto['points'][number]> = {}): LockoutDto['points'][number] => ({
  entryId, tag, kind: 'valve', lineNumber: 'L-100', requiredPosition: 'closed', lockBoxId: null, locks: [], protected: false, positionFound: null, ...extra,
});

function board(over: Partial<LockoutDto> = {}): LockoutDto {
  return {
    workOrderId: 'wo-1', number: 'WO-2027-0001', state: 'planned', points: [], lockBox: null, verification: null,
    isolated: false, missing: [], removedLocks: [], myLocks: [], ...over,
  };
}

describe('the lock board, read for the signed-in person', () => {
  it('shows on every order past draft, and not on a draft or a cancelled one', () => {
    expect(showsLockBoard('draft')).toBe(false);
    expect(showsLockBoard('cancelled')).toBe(false);
    expect(showsLockBoard('planned')).toBe(true);
    expect(showsLockBoard('closed')).toBe(true);
  });

  it('offers lock events in the states the server takes them', () => {
    expect(['planned', 'isolated', 'in-work', 'curing', 'testing'].every(locksMayGoOn)).toBe(true);
    expect(['ready', 'released', 'closed'].some(locksMayGoOn)).toBe(false);
    expect(sectionOpen('in-work')).toBe(true);
    expect(sectionOpen('testing')).toBe(false);
  });

  it('offers the verification once, on a planned order or after the locks were off, and not while one stands', () => {
    const verification = { id: 'v', verifiedBy: ann, verifiedAt: '2027-03-01T07:00:00.000Z', method: 'drain', reading: '0 psi', points: [] };
    expect(mayBeVerified(board({ state: 'planned' }))).toBe(true);
    expect(mayBeVerified(board({ state: 'testing' }))).toBe(true);
    expect(mayBeVerified(board({ state: 'planned', verification }))).toBe(false);
    expect(mayBeVerified(board({ state: 'curing' }))).toBe(false);
    expect(samePosition(' Closed', 'closed')).toBe(true);
    expect(samePosition('open', 'closed')).toBe(false);
  });

  it('asks for a lock on each point not yet carrying mine, and on the box instead of the points whose keys are in it', () => {
    const mine = lock('a1', ann, { entryId: 'e1' });
    const b = board({
      points: [point('e1', 'HV-1', { locks: [mine], protected: true }), point('e2', 'HV-2', { locks: [lock('b1', ben, { entryId: 'e2' })], protected: true }), point('e3', 'HV-3', { lockBoxId: 'box' })],
      lockBox: { id: 'box', label: 'LB-7', responsible: ben, locks: [], createdAt: '2027-03-01T06:00:00.000Z' },
      myLocks: [mine],
    });
    expect(targetsNeedingMyLock(b).map((r) => r.label)).toEqual(['Lock box LB-7', 'HV-2']);
    expect(isMine(b, mine)).toBe(true);
    expect(unprotectedPoints(b).map((p) => p.tag)).toEqual(['HV-3']);
  });

  it('asks nothing for the box once my lock is on it', () => {
    const onBox = lock('a2', ann, { lockBoxId: 'box' });
    const b = board({
      points: [point('e3', 'HV-3', { lockBoxId: 'box', protected: true })],
      lockBox: { id: 'box', label: 'LB-7', responsible: ann, locks: [onBox], createdAt: '2027-03-01T06:00:00.000Z' },
      myLocks: [onBox],
    });
    expect(targetsNeedingMyLock(b)).toEqual([]);
    expect(placeOf(b, onBox)).toBe('lock box LB-7');
  });

  it('sends only the targets given a number, trimmed', () => {
    const b = board({ points: [point('e1', 'HV-1'), point('e2', 'HV-2')] });
    const rows = targetsNeedingMyLock(b);
    expect(toLocksApply(rows, { 'point:e1': ' 12 ', 'point:e2': '  ' })).toEqual({ locks: [{ entryId: 'e1', lockNumber: '12' }] });
  });

  it('finds a lock number typed twice, or already on one of my locks, whatever its case', () => {
    expect(repeatedNumbers(['12', 'a7', ' 12', ''], [])).toEqual(['12']);
    expect(repeatedNumbers(['A7'], ['a7'])).toEqual(['A7']);
    expect(repeatedNumbers(['1', '2'], ['3'])).toEqual([]);
  });

  it('lists the people with locks on for a handover, by name, without me, each with every lock they hold', () => {
    const b = board({
      points: [point('e1', 'HV-1', { locks: [lock('b1', ben, { entryId: 'e1' }), lock('a1', ann, { entryId: 'e1' })] })],
      lockBox: { id: 'box', label: 'LB-7', responsible: ben, locks: [lock('b2', ben, { lockBoxId: 'box' })], createdAt: '2027-03-01T06:00:00.000Z' },
    });
    expect(lockHolders(b, ann.id).map((h) => [h.person.name, h.locks.map((l) => l.id)])).toEqual([['Ben Wu', ['b1', 'b2']]]);
    expect(lockHolders(b).map((h) => h.person.name)).toEqual(['Ann Ortiz', 'Ben Wu']);
    const [ben1, ben2] = lockHolders(b, ann.id)[0]!.locks;
    expect(toHandover(ben.id, [ben1!, ben2!], { b1: ' 40 ', b2: '41' })).toEqual({ fromPersonId: ben.id, locks: [{ replacesLockId: 'b1', lockNumber: '40' }, { replacesLockId: 'b2', lockNumber: '41' }] });
  });

  it('names the lock a handover replaced, even once it is off', () => {
    const old = lock('b1', ben, { entryId: 'e1' }, { removedAt: '2027-03-01T14:05:00.000Z', removal: 'owner', removedBy: ben });
    const now = lock('a1', ann, { entryId: 'e1' }, { handedOverFromLockId: 'b1' });
    const b = board({ points: [point('e1', 'HV-1', { locks: [now], protected: true })], removedLocks: [old] });
    expect(handedOverFrom(b, now)?.person.name).toBe('Ben Wu');
    expect(handedOverFrom(b, old)).toBeUndefined();
  });

  it('prefills each position found with the last one found, else the required one', () => {
    const b = board({ points: [point('e1', 'HV-1', { positionFound: 'closed, chained' }), point('e2', 'BL-2', { kind: 'blind', requiredPosition: 'installed' })] });
    expect(positionDefaults(b)).toEqual({ e1: 'closed, chained', e2: 'installed' });
  });

  it('turns a local date and time into an instant and back', () => {
    const at = new Date(2027, 2, 1, 6, 5);
    expect(toLocalInput(at)).toBe('2027-03-01T06:05');
    expect(localInputToIso('2027-03-01T06:05')).toBe(at.toISOString());
    expect(localInputToIso('')).toBeNull();
    expect(localInputToIso('not a time')).toBeNull();
  });
});
