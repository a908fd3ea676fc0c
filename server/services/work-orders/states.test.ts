import { describe, expect, it } from 'vitest';
import { AppError } from '@server/errors';
import { WORK_ORDER_STATES } from '@shared/schemas/work-orders';
import { assertStep, mayStep, moveTo, refusalOf, STEPS } from './states';

const refusal = (fn: () => unknown) => {
  try {
    fn();
  } catch (err) {
    return err;
  }
  throw new Error('not refused');
};

describe('the work-order states', () => {
  it('knows every state, and every step of the main line one at a time', () => {
    expect(Object.keys(STEPS).sort()).toEqual([...WORK_ORDER_STATES].sort());
    const chain = ['draft', 'planned', 'isolated', 'in-work', 'curing', 'testing', 'ready', 'released', 'closed'] as const;
    for (let i = 0; i + 1 < chain.length; i++) expect(mayStep(chain[i]!, chain[i + 1]!), `${chain[i]} → ${chain[i + 1]}`).toBe(true);
  });

  it('a failed test goes back to in work, an edited plan back to draft; cancelled and closed go nowhere', () => {
    expect(mayStep('testing', 'in-work')).toBe(true);
    expect(mayStep('planned', 'draft')).toBe(true);
    for (const to of WORK_ORDER_STATES) {
      expect(mayStep('cancelled', to)).toBe(false);
      expect(mayStep('closed', to)).toBe(false);
    }
  });

  it('cancelling is a step from draft to ready, never after release', () => {
    for (const from of ['draft', 'planned', 'isolated', 'in-work', 'curing', 'testing', 'ready'] as const) expect(mayStep(from, 'cancelled')).toBe(true);
    expect(mayStep('released', 'cancelled')).toBe(false);
  });

  it('a step that skips a state is a 409 whose sentence names each state it skips and what reaches it', () => {
    const err = refusal(() => assertStep('WO-2026-0007', 'draft', 'in-work'));
    expect(err).toBeInstanceOf(AppError);
    expect(err).toMatchObject({ status: 409, code: 'state_conflict' });
    expect((err as AppError).message).toBe(
      'WO-2026-0007 is draft; it cannot become in work before it has been planned (a complete plan is submitted (lines, joint tasks, an isolation plan, a window and the cure conditions)), ' +
        'then isolated (every point of the isolation plan carries a lock and zero energy is verified).',
    );
  });

  it('a step backwards or sideways says where the order can go from here', () => {
    expect(refusalOf('WO-1', 'curing', 'planned')).toBe(
      'WO-1 is curing; it cannot become planned from here. From curing it goes to testing when the last cure hold ends; or in work when a joint is cut out for redo; or cancelled when a supervisor cancels it once every lock is off.',
    );
    expect(refusalOf('WO-1', 'planned', 'planned')).toBe('WO-1 is already planned.');
    expect(refusalOf('WO-1', 'cancelled', 'draft')).toBe('WO-1 is cancelled; nothing more happens to a cancelled order.');
  });

  it('moveTo gives the new state for an allowed step', () => {
    expect(moveTo({ number: 'WO-1', state: 'draft' }, 'planned')).toBe('planned');
  });
});
