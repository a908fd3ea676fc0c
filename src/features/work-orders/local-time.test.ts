import { describe, expect, it } from 'vitest';
import { addDays, dayKey, isoToLocalInput, localInputToIso, weekStart } from '@/features/work-orders/local-time';

describe('times typed in the viewer’s zone', () => {
  it('a datetime-local value goes to the API as the instant it means, and comes back as the same wall-clock text', () => {
    const iso = localInputToIso('2027-03-01T06:00')!;
    expect(new Date(iso).getHours()).toBe(6);
    expect(isoToLocalInput(iso)).toBe('2027-03-01T06:00');
    expect(localInputToIso('')).toBeNull();
  });

  it('a week starts on its Monday', () => {
    expect(dayKey(weekStart(new Date(2027, 2, 4)))).toBe('2027-03-01');
    expect(dayKey(weekStart(new Date(2027, 2, 7)))).toBe('2027-03-01');
    expect(dayKey(addDays(weekStart(new Date(2027, 2, 1)), 7))).toBe('2027-03-08');
  });
});
