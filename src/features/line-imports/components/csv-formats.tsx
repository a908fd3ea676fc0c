import type { ImportKind } from '@shared/schemas/line-imports';
import { REGISTER_COLUMNS } from '@shared/schemas/register-columns';
import { TEMPLATE_FILENAMES, templateHref } from '@/features/line-imports/csv-template';

const TITLES: Record<ImportKind, string> = { lines: 'Lines file', 'isolation-points': 'Isolation-points file' };
const SAMPLES: Record<ImportKind, string> = { lines: 'docs/sample-lines.csv', 'isolation-points': 'docs/sample-isolation-points.csv' };

/** One of the two file layouts: its columns, a header-only template and where the sample lives. */
export function CsvFormat({ kind }: { kind: ImportKind }) {
  return (
    <section className="rounded-xl border border-ink/10 bg-paper-raised p-4 shadow-sm">
      <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-base font-semibold">{TITLES[kind]}</h2>
        <a
          href={templateHref(kind)}
          download={TEMPLATE_FILENAMES[kind]}
          className="inline-flex min-h-11 items-center gap-2 rounded-lg border border-ink/20 px-3 text-sm font-semibold hover:bg-paper-sunk"
        >
          <span aria-hidden>↓</span> Download a template
        </a>
      </div>
      <table className="w-full text-left text-sm">
        <tbody>
          {REGISTER_COLUMNS[kind].map((c) => (
            <tr key={c.column} className="border-t border-ink/5 align-top">
              <td className="whitespace-nowrap py-1.5 pr-3">
                <code className="rounded bg-paper-sunk px-1.5 py-0.5 font-sans text-[13px] font-semibold">{c.column}</code>
              </td>
              <td className="py-1.5 text-ink-soft">
                {c.help}
                {!c.required && <span className="ml-1 text-ink-faint">(optional)</span>}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-faint">
        A filled-in example is in the repository at <code className="rounded bg-paper-sunk px-1 font-sans font-medium text-ink-soft">{SAMPLES[kind]}</code>.
      </p>
    </section>
  );
}
