// Instants as the plant reads them: in the plant's time zone (a plant setting), with the zone named.

const formats = new Map<string, Intl.DateTimeFormat>();

/** "Mon, 07 Dec 2026, 06:00 GMT-6" for `at` in `timeZone`. */
export function plantTime(at: Date | string, timeZone: string): string {
  let f = formats.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', {
      timeZone, weekday: 'short', day: '2-digit', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZoneName: 'short',
    });
    formats.set(timeZone, f);
  }
  return f.format(typeof at === 'string' ? new Date(at) : at);
}
