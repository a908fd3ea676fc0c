import { describe, expect, it } from 'vitest';
import { heldMinutes, initialTestForm, leakCandidates, releaseRecord, testBodyFrom, toInstant, toNumber, type TestForm } from './test-form';

const order = {
  lines: [{ lineNumber: 'SA-001' }, { lineNumber: 'SA-002' }],
  testPressure: { testPsi: 225 },
} as unknown as Parameters<typeof initialTestForm>[0];
const J1 = '11111111-1111-4111-8111-111111111111';

const filled = (over: Partial<TestForm> = {}): TestForm => ({
  ...initialTestForm(order),
  toolsClear: true, peopleClear: true, gauge: 'PI-T3, 0–300 psi', startedAt: '2027-03-01T10:00', startReadingPsi: '225',
  endedAt: '2027-03-01T10:15', endReadingPsi: '224', result: 'passed', examiner: 'R. Adeyemi', ...over,
});

describe('the test form', () => {
  it('starts with water, the order\'s test pressure and its lines as the piping tested, and nothing ticked', () => {
    const f = initialTestForm(order);
    expect(f).toMatchObject({ medium: 'water', testPressurePsi: '225', pipingIdentified: 'SA-001, SA-002', toolsClear: false, peopleClear: false, result: '' });
  });

  it('turns the local times into instants with an offset, and empty fields into nothing rather than 0', () => {
    expect(toInstant('2027-03-01T10:00')).toBe(new Date('2027-03-01T10:00').toISOString());
    expect(toInstant('')).toBeUndefined();
    expect(toInstant('not a time')).toBeUndefined();
    expect(toNumber('')).toBeUndefined();
    expect(toNumber(' 12.5 ')).toBe(12.5);
    expect(heldMinutes('2027-03-01T10:00', '2027-03-01T10:15')).toBe(15);
    expect(heldMinutes('2027-03-01T10:00', '')).toBeNull();
  });

  it('sends a filled form as the route\'s body, with no leaking joints on a pass', () => {
    const { body, problems } = testBodyFrom(filled({ leakingJointIds: [J1] }));
    expect(problems).toBeNull();
    expect(body).toMatchObject({ testPressurePsi: 225, startReadingPsi: 225, endReadingPsi: 224, result: 'passed', leakingJointIds: [], medium: 'water' });
    expect(body!.endedAt).toBe(new Date('2027-03-01T10:15').toISOString());
    expect(body!.notes).toBeUndefined();
  });

  it('refuses before sending: the (f)(1) ticks and an empty reading; then an end before the start and a failure without joints', () => {
    const first = testBodyFrom(filled({ toolsClear: false, startReadingPsi: '', endedAt: '2027-03-01T09:00', result: 'failed' })).problems!;
    expect(Object.keys(first).sort()).toEqual(['startReadingPsi', 'toolsClear']);
    expect(first.toolsClear).toEqual(['confirm tools and materials are clear of the section']);
    // The schema's cross-field rules run once every field reads: the route answers the same.
    const second = testBodyFrom(filled({ endedAt: '2027-03-01T09:00', result: 'failed' })).problems!;
    expect(second).toEqual({ endedAt: ['must be after the start'], leakingJointIds: ['name the joints that leaked'] });
  });

  it('offers as leaking only the joints still in the line', () => {
    const tasks = [{ id: 'a', redone: false }, { id: 'b', redone: true }] as unknown as Parameters<typeof leakCandidates>[0];
    expect(leakCandidates(tasks).map((t) => t.id)).toEqual(['a']);
  });
});

describe('the release record', () => {
  it('reads who released the order and when from the last release entry of its history', () => {
    const history = [
      { at: '2027-03-01T10:00:00Z', action: 'pressure-test-passed', actor: { id: 'p', name: 'Ola' }, before: {}, after: {} },
      { at: '2027-03-01T11:00:00Z', action: 'order-released', actor: { id: 'q', name: 'Mara Quist' }, before: {}, after: { releasedBy: 'Mara Quist', notes: 'refilled over 20 min' } },
    ];
    expect(releaseRecord(history)).toEqual({ by: 'Mara Quist', at: '2027-03-01T11:00:00Z', notes: 'refilled over 20 min' });
    expect(releaseRecord(history.slice(0, 1))).toBeNull();
  });
});
