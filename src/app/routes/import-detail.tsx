import { useEffect, useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { ROW_OUTCOMES, type ImportStatus, type RowOutcome } from '@shared/schemas/line-imports';
import { ApiRequestError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format';
import { ensureOrShowRefusal } from '@/lib/loaders';
import { queryClient } from '@/lib/query-client';
import { lineImportQueries, useCancelImport, useConfirmImport, type ImportRowFilters } from '@/features/line-imports/api';
import { lineQueries } from '@/features/lines/api';
import { ImportStatusPanel } from '@/features/line-imports/components/import-status';
import { ImportRowsTable } from '@/features/line-imports/components/import-rows-table';
import { OutcomeTabs } from '@/features/line-imports/components/outcome-tabs';
import { PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { Pager } from '@/components/ui/pager';

const PAGE_SIZE = 100;
const TITLES: Record<ImportStatus, string> = { previewing: 'Import preview', previewed: 'Import preview', applying: 'Writing the import', applied: 'Import written', failed: 'Import not written', cancelled: 'Import cancelled' };

// Not found, not allowed, not an id: said inside the page with the server's words.
export const loader = ({ params }: LoaderFunctionArgs) => ensureOrShowRefusal(lineImportQueries.detail(params.id!));

function rowFilters(params: URLSearchParams): ImportRowFilters {
  const outcome = params.get('outcome') as RowOutcome | null;
  const page = Math.max(1, Number.parseInt(params.get('page') ?? '1', 10) || 1);
  return { page, pageSize: PAGE_SIZE, outcome: outcome && ROW_OUTCOMES.includes(outcome) ? outcome : undefined };
}

export default function ImportDetailPage() {
  const { id } = useParams() as { id: string };
  const [params, setParams] = useSearchParams();
  const filters = useMemo(() => rowFilters(params), [params]);
  const { data: imp, error } = useQuery(lineImportQueries.detail(id));
  const confirm = useConfirmImport(id);
  const cancel = useCancelImport(id);
  // A cancelled import's preview rows are gone with it.
  const rowsReady = !!imp && imp.status !== 'previewing' && imp.status !== 'cancelled' && imp.totalRows > 0;
  const rows = useQuery({ ...lineImportQueries.rows(id, filters), enabled: rowsReady });

  useEffect(() => {
    // The register changed: every list and line page reads it again.
    if (imp?.status === 'applied') void queryClient.invalidateQueries({ queryKey: lineQueries.all() });
  }, [imp?.status]);

  const show = (patch: Partial<ImportRowFilters>) => {
    const next = { ...filters, ...patch };
    const q = new URLSearchParams();
    if (next.outcome) q.set('outcome', next.outcome);
    if (next.page > 1) q.set('page', String(next.page));
    setParams(q, { replace: true });
    if (patch.page) window.scrollTo({ top: 0 });
  };

  if (error) {
    return (
      <div className="max-w-2xl space-y-3">
        <Notice tone="refusal" title="This import cannot be shown">
          {error.message}
        </Notice>
        <Link to="/imports/new" className="inline-flex min-h-11 items-center font-medium text-tide hover:underline">
          ← Import lines
        </Link>
      </div>
    );
  }
  if (!imp) return <p className="text-ink-soft">Loading the import…</p>;

  const kindWord = imp.kind === 'lines' ? 'Lines' : 'Isolation points';
  return (
    <>
      <PageHeader
        title={TITLES[imp.status]}
        subtitle={
          <>
            <span className="font-medium text-ink">{imp.filename}</span> · {kindWord} file{imp.totalRows > 0 && ` · ${imp.totalRows} ${imp.totalRows === 1 ? 'row' : 'rows'}`} · uploaded{' '}
            {formatDateTime(imp.createdAt)}
          </>
        }
      />
      <div className="mb-4">
        <ImportStatusPanel
          imp={imp}
          onConfirm={() => confirm.mutate()}
          confirming={confirm.isPending}
          confirmError={confirm.error?.message}
          // Refused as stale or already confirmed: pressing again cannot help.
          confirmRefused={confirm.error instanceof ApiRequestError && confirm.error.status === 409}
          onCancel={() => cancel.mutate()}
          cancelling={cancel.isPending}
          cancelError={cancel.error?.message}
        />
      </div>
      {rowsReady && (
        <>
          <div className="mb-3">
            <OutcomeTabs counts={imp.counts} total={imp.totalRows} active={filters.outcome} onChange={(outcome) => show({ outcome, page: 1 })} />
          </div>
          {rows.error && (
            <Notice tone="refusal" title="The rows could not be loaded">
              {rows.error.message}
            </Notice>
          )}
          {rows.data && (
            <>
              {rows.data.total > PAGE_SIZE && (
                <div className="mb-3">
                  <Pager page={filters.page} pageSize={PAGE_SIZE} total={rows.data.total} onPage={(page) => show({ page })} busy={rows.isFetching} />
                </div>
              )}
              <ImportRowsTable rows={rows.data.rows} kind={imp.kind} written={imp.status === 'applied'} dimmed={rows.isPlaceholderData} />
              <div className="mt-3">
                <Pager page={filters.page} pageSize={PAGE_SIZE} total={rows.data.total} onPage={(page) => show({ page })} busy={rows.isFetching} />
              </div>
            </>
          )}
        </>
      )}
    </>
  );
}
