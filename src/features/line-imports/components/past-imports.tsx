import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import type { ImportStatus, LineImportDto } from '@shared/schemas/line-imports';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { Pager } from '@/components/ui/pager';
import { formatDateTime } from '@/lib/format';
import { lineImportQueries } from '@/features/line-imports/api';

const PAGE_SIZE = 10;

/** How each stage of an import reads in the list: plain words, and a mark that does not rely on colour alone. */
const STAGES: Record<ImportStatus, { word: string; tone: string }> = {
  previewing: { word: 'Being checked', tone: 'text-ink' },
  previewed: { word: 'Waiting for confirmation', tone: 'text-hold' },
  applying: { word: 'Being written', tone: 'text-ink' },
  applied: { word: 'Written', tone: 'text-tide' },
  failed: { word: 'Failed, nothing written', tone: 'text-refuse' },
  cancelled: { word: 'Cancelled, nothing written', tone: 'text-ink-soft' },
};

function Counts({ imp }: { imp: LineImportDto }) {
  if (imp.status === 'previewing') return <span className="text-ink-soft">{imp.progress}% checked</span>;
  const { counts } = imp;
  return (
    <span className="tabular-nums">
      {counts.new} new · {counts.changed} changed · {counts.unchanged} unchanged
      {counts.rejected > 0 && <span className="font-semibold text-refuse"> · {counts.rejected} rejected</span>}
    </span>
  );
}

/** Every file uploaded to the register, newest first: what it was, who sent it, and how it ended. */
export function PastImports() {
  const [page, setPage] = useState(1);
  const list = useQuery(lineImportQueries.list(page, PAGE_SIZE));
  return (
    <Card title="Past imports">
      {list.isError && (
        <Notice tone="refusal" title="The past imports could not be loaded">
          {list.error.message}
        </Notice>
      )}
      {list.data && list.data.total === 0 && <p className="text-sm text-ink-soft">No file has been imported yet.</p>}
      {list.data && list.data.total > 0 && (
        <>
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm">
              <thead className="border-b border-ink/15 text-ink-soft">
                <tr>
                  <th scope="col" className="py-2 pr-3 font-semibold">File</th>
                  <th scope="col" className="py-2 pr-3 font-semibold">Uploaded</th>
                  <th scope="col" className="py-2 pr-3 font-semibold">Rows</th>
                  <th scope="col" className="py-2 font-semibold">Stage</th>
                </tr>
              </thead>
              <tbody className={list.isPlaceholderData ? 'opacity-60' : undefined}>
                {list.data.rows.map((imp) => (
                  <tr key={imp.id} className="border-b border-ink/10 align-top last:border-0">
                    <td className="py-2 pr-3">
                      <Link to={`/imports/${imp.id}`} className="inline-flex min-h-11 items-center font-semibold text-tide underline">
                        {imp.filename}
                      </Link>
                      <span className="block text-ink-soft">{imp.kind === 'lines' ? 'Lines' : 'Isolation points'}</span>
                    </td>
                    <td className="py-2 pr-3">
                      {formatDateTime(imp.createdAt)}
                      <span className="block text-ink-soft">{imp.uploadedBy}</span>
                    </td>
                    <td className="py-2 pr-3">
                      <Counts imp={imp} />
                    </td>
                    <td className={`py-2 font-semibold ${STAGES[imp.status].tone}`}>{STAGES[imp.status].word}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {list.data.total > PAGE_SIZE && (
            <div className="mt-3">
              <Pager page={page} pageSize={PAGE_SIZE} total={list.data.total} onPage={setPage} busy={list.isFetching} />
            </div>
          )}
        </>
      )}
      {list.isPending && <p className="text-sm text-ink-soft">Loading past imports…</p>}
    </Card>
  );
}
