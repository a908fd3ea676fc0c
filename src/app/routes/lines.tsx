import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { authQueries } from '@/lib/auth';
import { may } from '@shared/permissions';
import { lineQueries, useExportLines } from '@/features/lines/api';
import { filtersFromSearch, filtersToSearch, hasActiveFilters, type LineFilters } from '@/features/lines/filters';
import { LinesTable } from '@/features/lines/components/lines-table';
import { LineFilterBar } from '@/features/lines/components/line-filters';
import { Button, ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { Pager } from '@/components/ui/pager';

// Its loader is in src/app/first-screen-loaders.ts, so the register is asked for before this page's code runs (it is in the first bundle: src/app/router.tsx);
// the page draws without waiting for it and fills the table in when it comes.

const PAGE_SIZES = [25, 50, 100];

export default function LinesPage() {
  const [params, setParams] = useSearchParams();
  const filters = useMemo(() => filtersFromSearch(params), [params]);
  const { data, error, isPlaceholderData, isFetching } = useQuery(lineQueries.list(filters));
  const { data: me } = useQuery(authQueries.me());
  const mayImport = may(me, 'lines.import');
  const exportLines = useExportLines();

  /** Any change other than paging starts again at page 1. */
  const update = (patch: Partial<LineFilters>, replace = false) => {
    const next = { ...filters, ...patch, page: patch.page ?? 1 };
    setParams(filtersToSearch(next), { replace });
  };
  const onSort = (sort: LineFilters['sort']) => update({ sort, dir: filters.sort === sort && filters.dir === 'asc' ? 'desc' : 'asc' });

  return (
    <>
      <PageHeader
        title="Line register"
        subtitle={data ? `${data.total} ${data.total === 1 ? 'line' : 'lines'}${hasActiveFilters(filters) ? ' match' : ' in the plant'}` : 'Every process line in the plant'}
        actions={
          <>
            <Button variant="secondary" onClick={() => exportLines.mutate(filters)} disabled={exportLines.isPending}>
              {exportLines.isPending ? 'Exporting…' : 'Export CSV'}
            </Button>
            {mayImport && (
              <ButtonLink to="/imports/new">Import lines</ButtonLink>
            )}
          </>
        }
      />
      {exportLines.isError && (
        <div className="mb-4">
          <Notice tone="refusal" title="The export could not be made">
            {exportLines.error.message} Nothing was downloaded.
          </Notice>
        </div>
      )}
      <LineFilterBar filters={filters} facets={data?.facets} onChange={update} />
      {error && !data && (
        <Notice tone="refusal" title="The register could not be loaded">
          {error.message}
        </Notice>
      )}
      {!data && !error && (
        <p role="status" className="rounded-xl border border-ink/10 bg-paper-raised px-3 py-3 text-sm text-ink-soft">
          Loading the register…
        </p>
      )}
      {data && data.total === 0 && <EmptyRegister filtered={hasActiveFilters(filters)} mayImport={mayImport} onClear={() => setParams(new URLSearchParams())} />}
      {data && data.total > 0 && data.rows.length === 0 && (
        <Notice title="This page is past the end of the list">
          <button type="button" className="mt-1 min-h-11 font-medium text-tide underline" onClick={() => update({ page: 1 })}>
            Go to the first page
          </button>
        </Notice>
      )}
      {data && data.rows.length > 0 && (
        <>
          <LinesTable rows={data.rows} filters={filters} onSort={onSort} dimmed={isPlaceholderData} />
          <div className="mt-3 flex flex-wrap items-center justify-between gap-3">
            <Pager page={filters.page} pageSize={filters.pageSize} total={data.total} onPage={(page) => (update({ page }), window.scrollTo({ top: 0 }))} busy={isFetching} />
            <label className="flex items-center gap-2 text-sm text-ink-soft">
              Rows per page
              <select
                value={filters.pageSize}
                onChange={(e) => update({ pageSize: Number(e.target.value) })}
                className="min-h-11 rounded-lg border border-ink/25 bg-paper-raised px-2"
              >
                {PAGE_SIZES.map((n) => (
                  <option key={n}>{n}</option>
                ))}
              </select>
            </label>
          </div>
        </>
      )}
    </>
  );
}

function EmptyRegister({ filtered, mayImport, onClear }: { filtered: boolean; mayImport: boolean; onClear: () => void }) {
  return (
    <div className="rounded-xl border border-dashed border-ink/25 bg-paper-raised px-6 py-12 text-center">
      <svg aria-hidden width="56" height="24" viewBox="0 0 56 24" className="mx-auto mb-3 text-ink-faint">
        <path d="M2 8h18v8H2zM36 8h18v8H36z" fill="none" stroke="currentColor" strokeWidth="2" />
        <path d="M20 12h4M32 12h4" stroke="currentColor" strokeWidth="2" strokeDasharray="2 2" />
      </svg>
      {filtered ? (
        <>
          <p className="font-semibold">No line matches these filters</p>
          <button type="button" onClick={onClear} className="mt-2 min-h-11 font-medium text-tide underline">
            Clear the filters
          </button>
        </>
      ) : (
        <>
          <p className="font-semibold">The register has no lines yet</p>
          <p className="mt-1 text-ink-soft">
            {mayImport ? 'Import the plant’s line list from a CSV file to start.' : 'A planner imports the plant’s line list; ask them to load it.'}
          </p>
          {mayImport && (
            <ButtonLink to="/imports/new" className="mt-4">
              Import lines
            </ButtonLink>
          )}
        </>
      )}
    </div>
  );
}
