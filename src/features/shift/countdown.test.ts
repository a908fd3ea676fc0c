import { describe, expect, it } from 'vitest';
import { clockTime, formatCountdown, formatSeconds, msUntil } from './countdown';

describe('a hold counts down in words a fitter reads at arm’s length', () => {
  it('under an hour as minutes and seconds, rounded up so it never reads 0:00 while time is left', () => {
    expect(formatCountdown(42_000)).toBe('0:42');
    expect(formatCountdown(12 * 60_000 + 5_000)).toBe('12:05');
    expect(formatCountdown(200)).toBe('0:01');
    expect(formatCountdown(0)).toBe('0:00');
    expect(formatCountdown(-5_000)).toBe('0:00');
  });

  it('under two days as hours and minutes, then as days and hours', () => {
    expect(formatCountdown(3_600_000)).toBe('1 h 00 min');
    expect(formatCountdown(5 * 3_600_000 + 7 * 60_000)).toBe('5 h 07 min');
    expect(formatCountdown(47 * 3_600_000 + 59 * 60_000)).toBe('47 h 59 min');
    expect(formatCountdown(48 * 3_600_000)).toBe('2 days');
    expect(formatCountdown(76 * 3_600_000)).toBe('3 days 4 h');
  });

  it('the time left is counted from epoch milliseconds', () => {
    expect(msUntil('2027-03-01T12:00:30Z', Date.parse('2027-03-01T12:00:00Z'))).toBe(30_000);
  });

  it('the assembly hold shows whole seconds as m:ss', () => {
    expect(formatSeconds(30)).toBe('0:30');
    expect(formatSeconds(120)).toBe('2:00');
    expect(formatSeconds(59.9)).toBe('0:59');
    expect(formatSeconds(-3)).toBe('0:00');
  });

  it('an end time today shows the clock only; another day names the day', () => {
    const now = new Date(2027, 2, 1, 9, 0).getTime();
    expect(clockTime(new Date(2027, 2, 1, 14, 20).toISOString(), now)).toBe('2:20 PM');
    expect(clockTime(new Date(2027, 2, 2, 6, 0).toISOString(), now)).toBe('Tue, Mar 2, 6:00 AM');
  });
});
