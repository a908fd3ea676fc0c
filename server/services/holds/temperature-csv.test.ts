import { describe, expect, it } from 'vitest';
import { parseLoggedTime, readTemperatureLog, wallClockToInstant } from './temperature-csv';

const CHICAGO = 'America/Chicago';

describe('reading a data logger CSV', () => {
  it('skips the logger\'s metadata lines, reads ISO times and a °F column with humidity', () => {
    const text = 'Logger,Rack 3 north\nSerial,TL-20931\nTimestamp,Temperature (°F),RH (%)\n2026-12-02T14:00:00Z,62.5,55\n2026-12-02T14:05:00Z,58,61\n';
    const log = readTemperatureLog(text, CHICAGO);
    expect(log.problems).toEqual([]);
    expect(log.unit).toBe('F');
    expect(log.readings).toEqual([
      { at: new Date('2026-12-02T14:00:00Z'), temperatureF: 62.5, relativeHumidity: 55 },
      { at: new Date('2026-12-02T14:05:00Z'), temperatureF: 58, relativeHumidity: 61 },
    ]);
  });

  it('converts °C, reads local times in the plant\'s zone, and a date and a time column', () => {
    const log = readTemperatureLog('Date,Time,Temp °C\n12/02/2026,2:05 PM,15\n12/02/2026,2:10 PM,10\n', CHICAGO);
    expect(log.unit).toBe('C');
    expect(log.readings.map((r) => [r.at.toISOString(), r.temperatureF])).toEqual([
      ['2026-12-02T20:05:00.000Z', 59], // 14:05 in Chicago (UTC−6 in December)
      ['2026-12-02T20:10:00.000Z', 50],
    ]);
  });

  it('names each row it cannot read, and refuses a temperature column without a unit', () => {
    const log = readTemperatureLog('Time,Temperature (F)\n2026-12-02 08:00,61\nyesterday,60\n2026-12-02 08:10,warm\n', CHICAGO);
    expect(log.readings).toHaveLength(1);
    expect(log.problems).toEqual([
      'Line 3: "yesterday" is not a time this reader knows (ISO, "2026-12-02 14:05" or "12/02/2026 2:05 PM").',
      'Line 4: "warm" is not a temperature.',
    ]);
    expect(readTemperatureLog('Time,Temperature\n2026-12-02 08:00,61\n', CHICAGO).problems[0]).toMatch(/does not say °F or °C/);
  });

  it('reads a wall-clock time across the zone\'s summer time', () => {
    expect(wallClockToInstant(2026, 7, 1, 9, 0, 0, CHICAGO).toISOString()).toBe('2026-07-01T14:00:00.000Z'); // UTC−5
    expect(parseLoggedTime('2026-12-02 09:00', CHICAGO)!.toISOString()).toBe('2026-12-02T15:00:00.000Z'); // UTC−6
    expect(parseLoggedTime('12/02/2026 12:30 AM', CHICAGO)!.toISOString()).toBe('2026-12-02T06:30:00.000Z');
  });
});
