/** "Rows 51–100 of 312" with previous/next buttons; pages count from 1. */
export function Pager({ page, pageSize, total, onPage, busy }: { page: number; pageSize: number; total: number; onPage: (page: number) => void; busy?: boolean }) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  const btn = 'inline-flex min-h-11 min-w-11 items-center justify-center rounded-lg border border-ink/20 bg-paper-raised px-3 text-sm font-medium hover:bg-paper-sunk disabled:cursor-not-allowed disabled:text-ink-faint disabled:hover:bg-paper-raised';
  return (
    <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-3 text-sm">
      <p className="text-ink-soft" aria-live="polite">
        {total === 0 ? 'No rows' : `Rows ${first}–${last} of ${total}`}
        {busy && <span className="ml-2 text-ink-faint">· loading…</span>}
      </p>
      <div className="flex items-center gap-2">
        <button type="button" className={btn} disabled={page <= 1} onClick={() => onPage(page - 1)}>
          ← Previous
        </button>
        <span className="px-1 tabular-nums text-ink-soft">
          Page {Math.min(page, pages)} of {pages}
        </span>
        <button type="button" className={btn} disabled={page >= pages} onClick={() => onPage(page + 1)}>
          Next →
        </button>
      </div>
    </nav>
  );
}
