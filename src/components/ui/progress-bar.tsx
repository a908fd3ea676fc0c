/** A labelled determinate progress bar (0–100). */
export function ProgressBar({ value, label }: { value: number; label: string }) {
  const pct = Math.max(0, Math.min(100, Math.round(value)));
  return (
    <div>
      <div className="mb-1 flex justify-between text-sm">
        <span className="font-medium">{label}</span>
        <span className="tabular-nums text-ink-soft">{pct}%</span>
      </div>
      <div role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} className="h-3 overflow-hidden rounded-full bg-paper-sunk">
        <div className="h-full rounded-full bg-tide transition-[width] duration-500" style={{ width: `${pct}%` }} />
      </div>
    </div>
  );
}
