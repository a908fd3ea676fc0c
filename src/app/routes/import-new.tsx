import { useQuery } from '@tanstack/react-query';
import { Link, useNavigate } from 'react-router-dom';
import { authQueries } from '@/lib/auth';
import { may, whoMay } from '@shared/permissions';
import { useUploadImport } from '@/features/line-imports/api';
import { CsvDropZone } from '@/features/line-imports/components/csv-drop-zone';
import { CsvFormat } from '@/features/line-imports/components/csv-formats';
import { PastImports } from '@/features/line-imports/components/past-imports';
import { PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';

export default function ImportNewPage() {
  const navigate = useNavigate();
  const { data: me } = useQuery(authQueries.me());
  const upload = useUploadImport();
  const mayImport = may(me, 'lines.import');

  return (
    <>
      <PageHeader
        title="Import lines"
        subtitle="Add lines and their isolation points to the register, or update them, from a CSV file saved from a spreadsheet."
      />
      {!mayImport ? (
        <Notice tone="refusal" title="Importing is for planners and administrators">
          You can read the register; ask {whoMay('lines.import')} to import changes to it. <Link to="/lines" className="font-medium text-tide underline">Back to the line register</Link>
        </Notice>
      ) : (
        <div className="grid gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
          <div className="space-y-3">
            <CsvDropZone busy={upload.isPending} onFile={(file) => upload.mutate(file, { onSuccess: (imp) => navigate(`/imports/${imp.id}`) })} />
            {upload.isError && (
              <Notice tone="refusal" title="This file cannot be imported">
                {upload.error.message}
              </Notice>
            )}
            <Notice title="How an import works">
              <ol className="mt-1 list-decimal space-y-1 pl-4">
                <li>Upload the file. Linewright checks every row against the register.</li>
                <li>Review the preview: which lines are new, which change and how, and which rows are rejected and why.</li>
                <li>Confirm to write the new and changed rows. Rejected rows are skipped; fix them and import again.</li>
              </ol>
              <p className="mt-2">The file’s header row names the columns; units go in the header, not the cells (design_pressure_bar, design_temperature_c). A file with a <code className="rounded bg-ink/10 px-1 font-sans font-semibold">tag</code> column is read as isolation points.</p>
            </Notice>
          </div>
          <div className="space-y-4">
            <CsvFormat kind="lines" />
            <CsvFormat kind="isolation-points" />
          </div>
          <div className="lg:col-span-2">
            <PastImports />
          </div>
        </div>
      )}
    </>
  );
}
