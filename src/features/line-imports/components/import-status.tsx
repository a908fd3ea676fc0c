import { Link } from 'react-router-dom';
import type { LineImportDto } from '@shared/schemas/line-imports';
import { Button, ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { ProgressBar } from '@/components/ui/progress-bar';

const noun = (imp: LineImportDto, n: number) => (imp.kind === 'lines' ? (n === 1 ? 'line' : 'lines') : n === 1 ? 'isolation point' : 'isolation points');
const rows = (n: number) => `${n} ${n === 1 ? 'row' : 'rows'}`;

/** Where the import stands, and the one decision a preview asks for: write it, or go back. */
export function ImportStatusPanel(props: {
  imp: LineImportDto;
  onConfirm: () => void;
  confirming: boolean;
  confirmError?: string;
  confirmRefused?: boolean;
  /** Cancels the import (nothing written, its preview dropped). */
  onCancel: () => void;
  cancelling: boolean;
  cancelError?: string;
}) {
  const { imp, onConfirm, confirming, confirmError, confirmRefused, onCancel, cancelling, cancelError } = props;
  const cancelProblem = cancelError && (
    <Notice tone="refusal" title="The import was not cancelled">
      {cancelError}
    </Notice>
  );
  const { counts } = imp;
  const writes = counts.new + counts.changed;

  if (imp.status === 'previewing' || imp.status === 'applying') {
    return (
      <Card>
        <ProgressBar
          value={imp.progress}
          label={imp.status === 'previewing' ? `Checking ${imp.totalRows ? rows(imp.totalRows) : 'the file'} against the register…` : `Writing ${writes} ${noun(imp, writes)} to the register…`}
        />
        <div className="mt-2 flex flex-wrap items-center justify-between gap-3">
          <p className="text-sm text-ink-soft">You can leave this page; the work goes on and this import stays here to come back to.</p>
          <Button variant="secondary" onClick={onCancel} disabled={cancelling}>
            {cancelling ? 'Cancelling…' : 'Cancel this import'}
          </Button>
        </div>
        {cancelProblem && <div className="mt-3">{cancelProblem}</div>}
      </Card>
    );
  }
  if (imp.status === 'failed') {
    return (
      <Notice tone="refusal" title="The import failed. Nothing was written to the register.">
        {imp.error ?? 'The server gave no reason.'}{' '}
        <Link to="/imports/new" className="font-medium text-tide underline">
          Upload a file again
        </Link>
      </Notice>
    );
  }
  if (imp.status === 'cancelled') {
    return (
      <Notice title="This import was cancelled. Nothing was written to the register.">
        <Link to="/imports/new" className="font-medium text-tide underline">
          Upload a file again
        </Link>
      </Notice>
    );
  }
  if (imp.status === 'applied') {
    return (
      <Notice tone="success" title={`Written to the register: ${counts.new} new and ${counts.changed} changed ${noun(imp, writes)}.`}>
        {counts.rejected > 0 && <p>{rows(counts.rejected)} rejected and skipped; fix them in the file and import it again.</p>}
        <p className="mt-1 flex flex-wrap gap-x-4">
          <Link to="/lines" className="inline-flex min-h-11 items-center font-semibold text-tide underline">
            Open the line register
          </Link>
          <Link to="/imports/new" className="inline-flex min-h-11 items-center font-medium text-tide underline">
            Import another file
          </Link>
        </p>
      </Notice>
    );
  }

  return (
    <Card className="space-y-3">
      <p className="text-sm text-ink-soft">
        Nothing has been written yet.
        {counts.rejected > 0 && (
          <>
            {' '}
            <strong className="font-semibold text-refuse">
              {counts.rejected} rejected {counts.rejected === 1 ? 'row is' : 'rows are'} skipped
            </strong>
            : fix {counts.rejected === 1 ? 'it' : 'them'} in the file and import it again.
          </>
        )}
        {counts.unchanged > 0 && (counts.unchanged === 1 ? ' 1 row matches the register and stays as it is.' : ` ${counts.unchanged} rows match the register and stay as they are.`)}
      </p>
      {confirmError && (
        <Notice tone="refusal" title="The import was not written">
          {confirmError}
        </Notice>
      )}
      {cancelProblem}
      <div className="flex flex-wrap items-center gap-3">
        <Button onClick={onConfirm} disabled={confirming || writes === 0 || confirmRefused}>
          {confirming ? 'Writing…' : writes === 0 ? 'Nothing to write' : `Write ${counts.new} new and ${counts.changed} changed ${noun(imp, writes)} to the register`}
        </Button>
        {confirmRefused ? (
          <ButtonLink to="/imports/new" variant="ghost">
            Upload the file again
          </ButtonLink>
        ) : (
          <Button variant="ghost" onClick={onCancel} disabled={cancelling || confirming}>
            {cancelling ? 'Cancelling…' : 'Cancel this import'}
          </Button>
        )}
      </div>
    </Card>
  );
}
