import type { ReactNode } from 'react';
import type { JointPicture } from '@shared/trade';
import { duration, inches, metricPressure, mm, psi, type PressureUnit } from '@/lib/format';
import { plainReason, refusalTitle, whoDecides } from './facts';

function Figure({ label, value, sub }: { label: string; value: ReactNode; sub?: ReactNode }) {
  return (
    <div className="min-w-0 rounded-lg bg-paper-raised px-3 py-2">
      <p className="text-xs font-semibold uppercase tracking-wide text-ink-soft">{label}</p>
      <p className="text-xl font-bold tabular-nums">{value}</p>
      {sub && <p className="text-sm text-ink-soft tabular-nums">{sub}</p>}
    </div>
  );
}

function splitProblem(problem: string): { section: string; reason: string } {
  const m = /^(\w+): (.*)$/s.exec(problem);
  return m && m[1] && m[2] ? { section: m[1], reason: m[2] } : { section: '', reason: problem };
}

/** The answer in one look: within the tables or not, and the figures a fitter needs first. */
export function Verdict({ picture: p, unit, mark }: { picture: JointPicture; unit: PressureUnit; mark: ReactNode }) {
  const { cure, test, socket } = p;
  return (
    <section aria-labelledby="verdict" className={`rounded-xl border-2 p-4 ${p.ok ? 'border-tide/40 bg-tide-light/40' : 'border-refuse/50 bg-refuse-light'}`}>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <h2 id="verdict" className="text-lg font-bold">{p.ok ? 'Within the published tables' : 'Not allowed as entered'}</h2>
        {mark}
      </div>
      <div className="grid grid-cols-2 gap-2 @xl:grid-cols-4">
        <Figure label="Set" value={cure.ok ? duration(cure.setMinutes) : 'None'} sub={cure.ok ? undefined : 'not in the table'} />
        <Figure label="Cure" value={cure.ok ? duration(cure.cureMinutes) : 'None'} sub={cure.ok ? `schedule ${cure.schedule}` : 'not in the table'} />
        <Figure
          label="Test"
          value={test === null ? 'None' : test.ok ? psi(test.testPsi) : 'Refused'}
          sub={test?.ok ? `${metricPressure(test.testPsi, unit)}, hold ${duration(test.minHoldMinutes)}` : undefined}
        />
        <Figure label="Socket depth" value={socket.ok ? inches(socket.socketDepthIn) : 'Measure'} sub={socket.ok ? mm(socket.socketDepthIn) : undefined} />
      </div>
      {p.problems.length > 0 && (
        <ul className="mt-3 space-y-2" role="alert">
          {p.problems.map((problem) => {
            const { section, reason } = splitProblem(problem);
            return (
              <li key={problem} className="rounded-lg border border-refuse/30 bg-paper-raised p-3 text-sm">
                <p className="font-semibold">{refusalTitle(section)} ({section.toLowerCase()})</p>
                <p>{plainReason(reason)}</p>
                <p className="mt-1 font-semibold text-refuse">{whoDecides(section, reason)}</p>
              </li>
            );
          })}
        </ul>
      )}
      {p.notes.map((note) => (
        <p key={note} className="mt-2 text-sm text-ink-soft">{note}</p>
      ))}
    </section>
  );
}
