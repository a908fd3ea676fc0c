// The mail to whoever confirmed a large register import: written, or not written and why.

import { htmlMail } from '@server/mail/layout';
import type { ImportCounts } from '@shared/schemas/line-imports';

export interface ImportMailFacts {
  id: string;
  filename: string;
  counts: ImportCounts;
  error: string | null;
}

export function lineImportApplied(imp: ImportMailFacts, origin: string) {
  const { new: added, changed, unchanged, rejected } = imp.counts;
  const subject = `Line register import finished: ${added} new, ${changed} changed, ${unchanged} unchanged, ${rejected} skipped`;
  const counts = [`${added} new`, `${changed} changed`, `${unchanged} unchanged (nothing to write)`, `${rejected} skipped (rejected in the preview, not written)`];
  const href = `${origin}/imports/${imp.id}`;
  return {
    subject,
    text: `${imp.filename} has been written to the line register.\n\n${counts.map((c) => `  ${c}`).join('\n')}\n\nThe import: ${href}\n`,
    html: htmlMail(subject, [{ p: `${imp.filename} has been written to the line register.` }, { list: counts }, { link: { href, text: 'Open the import' } }]),
  };
}

export function lineImportFailed(imp: ImportMailFacts, origin: string) {
  const subject = `Line register import failed: ${imp.filename}`;
  const reason = imp.error ?? 'No reason was kept.';
  const href = `${origin}/imports/${imp.id}`;
  return {
    subject,
    text: `${imp.filename} could not be written to the line register.\n\n${reason}\n\nThe import: ${href}\n`,
    html: htmlMail(subject, [{ p: `${imp.filename} could not be written to the line register.` }, { p: reason }, { link: { href, text: 'Open the import' } }]),
  };
}
