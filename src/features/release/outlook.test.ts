import { describe, expect, it } from 'vitest';
import type { ReleaseBlocker } from '@shared/schemas/release';
import { blockerSummary, lineOutlook, lineReady, splitQueue, stateLabel, type QueueRow } from './outlook';

const NOW = Date.parse('2027-03-01T12:00:00Z');
const row = (over: Partial<QueueRow>): QueueRow => ({
  id: 'o', number: 'WO-1', state: 'curing', lines: ['L-1'], windowEnd: null, latestHoldEnd: null, ready: false, blockers: [], ...over,
});
const lock: ReleaseBlocker = { kind: 'lock', message: 'Lock 7 (Ann) is still on HV-1.', until: null };
const hold = (until: string | null): ReleaseBlocker => ({ kind: 'hold', message: "J1's cure hold …", until });
const test: ReleaseBlocker = { kind: 'test', message: 'No hydrostatic test is recorded.', until: null };
const stage: ReleaseBlocker = { kind: 'state', message: 'WO-1 is curing; …', until: null };

describe('the release queue', () => {
  it('puts the ready orders in their own group, each group keeping the server order', () => {
    const q = [row({ id: 'a' }), row({ id: 'b', ready: true }), row({ id: 'c' }), row({ id: 'd', ready: true })];
    const { ready, blocked } = splitQueue(q);
    expect(ready.map((r) => r.id)).toEqual(['b', 'd']);
    expect(blocked.map((r) => r.id)).toEqual(['a', 'c']);
  });

  it('names a state in our words, and an unknown one as it came', () => {
    expect(stateLabel('ready')).toBe('Ready for release');
    expect(stateLabel('in-work')).toBe('In work');
    expect(stateLabel('toString')).toBe('toString');
  });

  it('sums an order up in a few words: locks, holds and the missing test', () => {
    expect(blockerSummary([stage, lock, lock, hold('2027-03-01T13:00:00Z'), test])).toBe('2 locks on · 1 hold · no passed test');
    expect(blockerSummary([stage])).toBe('');
  });
});

describe('when a line can come back', () => {
  it('is not before the last running hold ends, and then needs the locks off, the test and the release, in that order', () => {
    const o = row({ blockers: [stage, test, lock, hold('2027-03-01T15:00:00Z')] });
    expect(lineOutlook({ orders: [o], earliestBack: '2027-03-01T15:00:00Z' }, NOW)).toEqual({
      notBefore: '2027-03-01T15:00:00Z',
      needs: ['every lock off', 'a passed hydrostatic test', "operations' release"],
    });
  });

  it('has no time once the holds have run out by the clock, only what it still needs', () => {
    const o = row({ state: 'testing', blockers: [stage, test] });
    expect(lineOutlook({ orders: [o], earliestBack: '2027-03-01T11:00:00Z' }, NOW)).toEqual({ notBefore: null, needs: ['a passed hydrostatic test', "operations' release"] });
  });

  it("names the joints still to be made and a hold waiting for a supervisor's engineering cure time", () => {
    const o = row({ state: 'in-work', blockers: [stage, lock, hold(null), test] });
    expect(lineOutlook({ orders: [o], earliestBack: null }, NOW).needs).toEqual([
      'the joints made', "a supervisor's engineering cure time", 'every lock off', 'a passed hydrostatic test', "operations' release",
    ]);
  });

  it('is ready only when every order holding it out is', () => {
    expect(lineReady({ orders: [row({ ready: true }), row({ ready: false })] })).toBe(false);
    expect(lineReady({ orders: [row({ ready: true })] })).toBe(true);
    expect(lineReady({ orders: [] })).toBe(false);
  });
});
