import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { REQUIRED_POSITION, type IsolationPlanEntryDto, type IsolationPlanEntryInput, type IsolationPlanResponse } from '@shared/schemas/isolation-plans';
import type { LineDto } from '@shared/schemas/lines';
import { ApiRequestError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Input, Select } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { useSetIsolationPlan, workOrderQueries } from '@/features/work-orders/api';

const KIND_WORDS: Record<string, string> = { valve: 'Valve', blind: 'Blind', disconnect: 'Disconnect', drain: 'Drain', vent: 'Vent' };
type Extra = { key: number; lineId: string; tag: string; kind: 'drain' | 'vent' | 'valve' | 'blind' | 'disconnect' };

function PlanTable({ entries }: { entries: IsolationPlanEntryDto[] }) {
  return (
    <table className="w-full text-left text-sm">
      <thead className="text-[13px] text-ink-soft">
        <tr className="border-b border-ink/10">
          <th scope="col" className="py-2 pr-3">Point</th>
          <th scope="col" className="py-2 pr-3">Kind</th>
          <th scope="col" className="py-2 pr-3">Line</th>
          <th scope="col" className="py-2">Must be</th>
        </tr>
      </thead>
      <tbody>
        {entries.map((e) => (
          <tr key={e.id} className="border-b border-ink/5 last:border-0">
            <td className="py-2 pr-3 font-semibold">{e.tag}</td>
            <td className="py-2 pr-3">{KIND_WORDS[e.kind]}{!e.isolationPointId && <span className="text-ink-soft"> (not in the register)</span>}</td>
            <td className="py-2 pr-3">{e.lineNumber}</td>
            <td className="py-2">{e.requiredPosition}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** The points that isolate the section, each with the position it must be in; pre-filled from the register. */
export function IsolationPlanCard({ orderId, lines, entries, mayEdit }: { orderId: string; lines: LineDto[]; entries: IsolationPlanEntryDto[]; mayEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  return (
    <Card
      title={`Isolation plan (${entries.length})`}
      actions={mayEdit && !editing && <Button variant="secondary" onClick={() => setEditing(true)}>{entries.length ? 'Change the plan' : 'Make the plan'}</Button>}
    >
      {editing ? (
        <PlanEditor orderId={orderId} lines={lines} entries={entries} onDone={() => setEditing(false)} />
      ) : entries.length ? (
        <PlanTable entries={entries} />
      ) : (
        <p className="text-sm text-ink-soft">No isolation plan yet. {mayEdit && 'It starts from the register’s points on the order’s lines.'}</p>
      )}
    </Card>
  );
}

function PlanEditor({ orderId, lines, entries, onDone }: { orderId: string; lines: LineDto[]; entries: IsolationPlanEntryDto[]; onDone: () => void }) {
  const { data, error } = useQuery(workOrderQueries.isolationPlan(orderId));
  if (error) return <Notice tone="refusal" title="The register’s points could not be loaded">{error.message}</Notice>;
  if (!data) return <p className="text-sm text-ink-soft">Loading the register’s points…</p>;
  return <PlanForm orderId={orderId} lines={lines} entries={entries} suggested={data.suggested} onDone={onDone} />;
}

function PlanForm({ orderId, lines, entries, suggested, onDone }: { orderId: string; lines: LineDto[]; entries: IsolationPlanEntryDto[]; suggested: IsolationPlanResponse['suggested']; onDone: () => void }) {
  const save = useSetIsolationPlan(orderId);
  // A new plan starts with every register point; a saved one with what it holds.
  const [picked, setPicked] = useState(() => new Set(suggested.filter((s) => (entries.length ? s.inPlan : true)).map((s) => s.isolationPointId!)));
  const [extras, setExtras] = useState<Extra[]>(() => entries.filter((e) => !e.isolationPointId).map((e, i) => ({ key: i, lineId: e.lineId, tag: e.tag, kind: e.kind })));
  const [next, setNext] = useState(extras.length);
  const details = save.error instanceof ApiRequestError ? save.error.details : undefined;

  const toggle = (id: string) => setPicked((s) => (s.has(id) ? (s.delete(id), new Set(s)) : new Set(s.add(id))));
  const addExtra = (kind: Extra['kind']) => (setExtras((x) => [...x, { key: next, lineId: lines[0]!.id, tag: '', kind }]), setNext((n) => n + 1));
  const change = (key: number, patch: Partial<Extra>) => setExtras((x) => x.map((e) => (e.key === key ? { ...e, ...patch } : e)));
  const submit = (ev: React.FormEvent) => {
    ev.preventDefault();
    const body: IsolationPlanEntryInput[] = [
      ...suggested.filter((s) => picked.has(s.isolationPointId!)).map((s) => ({ isolationPointId: s.isolationPointId! })),
      ...extras.map((e) => ({ lineId: e.lineId, tag: e.tag.trim(), kind: e.kind })),
    ];
    save.mutate({ entries: body }, { onSuccess: onDone });
  };

  return (
    <form onSubmit={submit} className="space-y-3" aria-label="Isolation plan">
      <fieldset>
        <legend className="mb-1 text-sm font-semibold">From the register</legend>
        {suggested.length === 0 && <p className="text-sm text-ink-soft">The order’s lines have no isolation points in the register.</p>}
        {suggested.map((s) => (
          <label key={s.isolationPointId} className="flex min-h-11 items-center gap-3 rounded-md px-2 text-sm hover:bg-paper-sunk">
            <input type="checkbox" className="h-5 w-5 accent-tide" checked={picked.has(s.isolationPointId!)} onChange={() => toggle(s.isolationPointId!)} />
            <span className="font-semibold">{s.tag}</span>
            <span className="text-ink-soft">{KIND_WORDS[s.kind]} on {s.lineNumber}: must be {s.requiredPosition}</span>
          </label>
        ))}
      </fieldset>
      <fieldset className="space-y-2">
        <legend className="mb-1 text-sm font-semibold">Drains, vents and points not in the register</legend>
        {extras.map((e, i) => (
          <div key={e.key} className="grid grid-cols-[1fr_1fr_1fr_auto] items-center gap-2">
            <Select aria-label={`Kind of added point ${i + 1}`} value={e.kind} onChange={(ev) => change(e.key, { kind: ev.target.value as Extra['kind'] })}>
              {Object.keys(REQUIRED_POSITION).map((k) => <option key={k} value={k}>{KIND_WORDS[k]} ({REQUIRED_POSITION[k as Extra['kind']]})</option>)}
            </Select>
            <Input aria-label={`Tag of added point ${i + 1}`} placeholder="Tag, e.g. DR-12" value={e.tag} onChange={(ev) => change(e.key, { tag: ev.target.value })} />
            <Select aria-label={`Line of added point ${i + 1}`} value={e.lineId} onChange={(ev) => change(e.key, { lineId: ev.target.value })}>
              {lines.map((l) => <option key={l.id} value={l.id}>{l.lineNumber}</option>)}
            </Select>
            <Button type="button" variant="ghost" aria-label={`Remove added point ${i + 1}`} onClick={() => setExtras((x) => x.filter((y) => y.key !== e.key))}>Remove</Button>
          </div>
        ))}
        <div className="flex flex-wrap gap-2">
          <Button type="button" variant="secondary" onClick={() => addExtra('drain')}>Add a drain</Button>
          <Button type="button" variant="secondary" onClick={() => addExtra('vent')}>Add a vent</Button>
          <Button type="button" variant="secondary" onClick={() => addExtra('valve')}>Add a point not in the register</Button>
        </div>
        {extras.some((e) => !['drain', 'vent'].includes(e.kind)) && (
          <p className="text-xs text-ink-soft">A valve, blind or disconnect added here joins the line register when the plan is saved; the change is recorded.</p>
        )}
      </fieldset>
      {save.error && (
        <Notice tone="refusal" title="The plan was not saved">
          {save.error.message}
          {details && <ul className="list-disc pl-5">{Object.entries(details).map(([k, m]) => <li key={k}>{m.join(' ')}</li>)}</ul>}
        </Notice>
      )}
      <div className="flex gap-2">
        <Button type="submit" disabled={save.isPending}>{save.isPending ? 'Saving…' : 'Save the isolation plan'}</Button>
        <Button type="button" variant="secondary" onClick={onDone}>Cancel</Button>
      </div>
    </form>
  );
}
