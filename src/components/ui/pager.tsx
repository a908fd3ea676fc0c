import { Button } from '@/components/ui/button';

/** "Rows 51–100 of 312" with previous/next buttons; pages count from 1. */
export function Pager({ page, pageSize, total, onPage, busy }: { page: number; pageSize: number; total: number; onPage: (page: number) => void; busy?: boolean }) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-3 text-sm">
      <p className="text-ink-soft" aria-live="polite">
        {total === 0 ? 'No rows' : `Rows ${first}–${last} of ${total}`}
        {busy && <span className="ml-2 text-ink-faint">· loading…</span>}
      </p>
      <div className="flex items-center gap-2">
        <Button type="button" variant="secondary" disabled={page <= 1} onClick={() => onPage(page - 1)}>
          ← Previous
        </Button>
        <span className="px-1 tabular-nums text-ink-soft">
          Page {Math.min(page, pages)} of {pages}
        </span>
        <Button type="button" variant="secondary" disabled={page >= pages} onClick={() => onPage(page + 1)}>
          Next →
        </Button>
      </div>
    </nav>
  );
}
