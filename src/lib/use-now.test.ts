import { describe, expect, it } from 'vitest';
import { timeLeft } from './use-now';

describe('timeLeft', () => {
  const t0 = Date.parse('2026-12-02T10:00:00Z');
  it('says what is left in the largest units that help', () => {
    expect(timeLeft(t0 + 12_000, t0)).toBe('12 s');
    expect(timeLeft(t0 + 249_000, t0)).toBe('4 min 09 s');
    expect(timeLeft(t0 + 2 * 3_600_000 + 5 * 60_000, t0)).toBe('2 h 05 min');
    expect(timeLeft(t0 + 50 * 3_600_000, t0)).toBe('2 d 2 h');
  });
  it('rounds a part second up, and is null once the end has passed', () => {
    expect(timeLeft(t0 + 400, t0)).toBe('1 s');
    expect(timeLeft(t0, t0)).toBeNull();
    expect(timeLeft(t0 - 5000, t0)).toBeNull();
  });
});
