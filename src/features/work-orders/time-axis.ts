const HOUR = 3_600_000;
const STEPS_H = [1, 2, 3, 6, 12, 24, 48, 72, 168];
const HOUR_FMT = new Intl.DateTimeFormat('en-US', { hour: 'numeric' });
const DAY_FMT = new Intl.DateTimeFormat('en-US', { weekday: 'short', month: 'short', day: 'numeric' });

/** Ticks across [from, to] at a round step that leaves about `px` pixels between labels (local time). */
export function timeTicks(from: number, to: number, width: number, px = 90): { at: number; label: string; day: boolean }[] {
  const wanted = ((to - from) / Math.max(1, width / px)) / HOUR;
  const stepH = STEPS_H.find((s) => s >= wanted) ?? 168;
  const first = new Date(from);
  first.setMinutes(0, 0, 0);
  if (stepH >= 24) first.setHours(0);
  else first.setHours(Math.ceil(first.getHours() / stepH) * stepH);
  const ticks = [];
  for (let t = first.getTime(); t <= to; t += stepH * HOUR) {
    if (t < from) continue;
    const d = new Date(t);
    const day = d.getHours() === 0;
    ticks.push({ at: t, label: day || stepH >= 24 ? DAY_FMT.format(d) : HOUR_FMT.format(d), day });
  }
  return ticks;
}
