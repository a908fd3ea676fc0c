import { useId, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { may } from '@shared/permissions';
import { TEMPERATURE_BANDS } from '@shared/trade';
import type { TemperatureLogDto } from '@shared/schemas/joint-steps';
import type { WorkOrderDto } from '@shared/schemas/work-orders';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { authQueries } from '@/lib/auth';
import { formatDateTime } from '@/lib/format';
import { temperatureLogQueries, useApplyTemperatureLog, useReadTemperatureLog } from '@/features/release/api';
import { bandSpan, plotFrame, polylinePoints, type PlotSize } from '@/features/release/temperature-plot';

/** A log is read and applied while the joints cure (the server's rule); afterwards the logs are only shown. */
const LOGGABLE: readonly string[] = ['in-work', 'curing'];
/** Orders that may have logs from their cure. */
const MAY_HAVE_LOGS: readonly string[] = ['in-work', 'curing', 'testing', 'ready', 'released', 'closed'];

const SIZE: PlotSize = { width: 640, height: 260, margin: { top: 40, right: 16, bottom: 28, left: 44 } };
// Palette colours, as in the window timeline: cool to warm bands, the line in tide, the ends in ink and amber.
const BAND_FILL: Record<string, string> = { '60-100': '#ccfbf1', '40-60': '#fef3c7', '0-40': '#dbeafe' };
const LINE = '#0b655e';
const INK = '#1d2731';
const SOFT = '#3d4a57';
const BY_LOG = '#92400e';
const TICK_TIME = new Intl.DateTimeFormat('en-US', { hour: 'numeric', minute: '2-digit' });
const TICK_DAY = new Intl.DateTimeFormat('en-US', { month: 'short', day: 'numeric' });

interface Marker { key: string; at: number; label: string; byLog: boolean }

/** Joints whose ends fall on the same minute share one line and one label ("J1, J2 cure end"). */
function mergeMarkers(markers: Marker[]): Marker[] {
  const byKey = new Map<string, Marker & { joints: string[] }>();
  for (const m of markers) {
    const k = `${Math.round(m.at / 60_000)}-${m.byLog}`;
    const joint = m.label.split(' ')[0]!;
    const seen = byKey.get(k);
    if (seen) seen.joints.push(joint);
    else byKey.set(k, { ...m, joints: [joint] });
  }
  return [...byKey.values()].map(({ joints, ...m }) => ({ ...m, label: `${joints.join(', ')} ${m.label.split(' ').slice(1).join(' ')}` }));
}

function plural(n: number, word: string) {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

/** The readings against the cure bands, with a line where each cure hold ends now (and, for a preview, by the log). */
function TemperaturePlot({ log, markers }: { log: TemperatureLogDto; markers: Marker[] }) {
  const offsetMs = -new Date().getTimezoneOffset() * 60_000;
  const frame = plotFrame(log.readings, markers.map((m) => m.at), SIZE, offsetMs);
  const temps = log.readings.map((r) => r.temperatureF);
  const summary = temps.length
    ? `Temperature from ${Math.min(...temps)} to ${Math.max(...temps)} °F between ${formatDateTime(log.readings[0].at)} and ${formatDateTime(log.readings[log.readings.length - 1].at)}` +
      (markers.length ? `; ${markers.map((m) => `${m.label} ${formatDateTime(new Date(m.at).toISOString())}`).join(', ')}` : '')
    : 'No readings';
  const multiDay = frame.tMax - frame.tMin > 36 * 3_600_000;
  const plotLeft = SIZE.margin.left;
  const plotRight = SIZE.width - SIZE.margin.right;
  const plotBottom = SIZE.height - SIZE.margin.bottom;
  return (
    <svg viewBox={`0 0 ${SIZE.width} ${SIZE.height}`} role="img" aria-label={summary} className="block h-auto w-full font-sans">
      {TEMPERATURE_BANDS.map((band) => {
        const span = bandSpan(band, frame);
        if (!span) return null;
        return (
          <g key={band.id}>
            <rect x={plotLeft} y={span.y} width={plotRight - plotLeft} height={span.height} fill={BAND_FILL[band.id] ?? '#eef2f5'} opacity="0.7" />
            <text x={plotRight - 4} y={span.y + span.height - 4} fontSize="11" fill={SOFT} textAnchor="end">{band.label}</text>
          </g>
        );
      })}
      {frame.temperatureTicks.map((f) => (
        <g key={f}>
          <line x1={plotLeft} x2={plotRight} y1={frame.y(f)} y2={frame.y(f)} stroke={INK} strokeOpacity="0.1" />
          <text x={plotLeft - 6} y={frame.y(f) + 4} fontSize="11" fill={SOFT} textAnchor="end">{f}°</text>
        </g>
      ))}
      {frame.timeTicks.map((t) => (
        <g key={t}>
          <line x1={frame.x(t)} x2={frame.x(t)} y1={plotBottom} y2={plotBottom + 4} stroke={INK} strokeOpacity="0.4" />
          <text x={frame.x(t)} y={plotBottom + 17} fontSize="11" fill={SOFT} textAnchor="middle">
            {multiDay ? `${TICK_DAY.format(t)} ${TICK_TIME.format(t)}` : TICK_TIME.format(t)}
          </text>
        </g>
      ))}
      <line x1={plotLeft} x2={plotRight} y1={plotBottom} y2={plotBottom} stroke={INK} strokeOpacity="0.4" />
      <text x={4} y={SIZE.margin.top - 8} fontSize="11" fill={SOFT}>°F</text>
      <polyline points={polylinePoints(log.readings, frame)} fill="none" stroke={LINE} strokeWidth="2" strokeLinejoin="round" />
      {markers.map((m, i) => {
        const x = frame.x(m.at);
        const nearRight = x > plotRight - 90;
        return (
          <g key={m.key}>
            <line x1={x} x2={x} y1={SIZE.margin.top - 6} y2={plotBottom} stroke={m.byLog ? BY_LOG : INK} strokeWidth="1.5" strokeDasharray={m.byLog ? '5 3' : undefined} />
            <text x={nearRight ? x - 3 : x + 3} y={10 + (i % 3) * 11} fontSize="11" fontWeight="600" fill={m.byLog ? BY_LOG : INK} textAnchor={nearRight ? 'end' : 'start'}>
              {m.label}
            </text>
          </g>
        );
      })}
    </svg>
  );
}

/** Each running hold's end now and by the log, or why the log leaves it to an engineering entry. */
function PreviewHolds({ log }: { log: TemperatureLogDto }) {
  if (!log.holds.length) return <p>No running hold for the log to change.</p>;
  return (
    <table className="w-full text-left text-sm">
      <thead className="text-ink-soft">
        <tr><th className="py-1 pr-3 font-medium">Joint</th><th className="py-1 pr-3 font-medium">Hold</th><th className="py-1 pr-3 font-medium">Ends now</th><th className="py-1 font-medium">By the log</th></tr>
      </thead>
      <tbody className="divide-y divide-ink/10">
        {log.holds.map((h) => (
          <tr key={h.holdId}>
            <td className="py-1.5 pr-3 font-semibold">{h.joint}</td>
            <td className="py-1.5 pr-3">{h.kind}</td>
            <td className="py-1.5 pr-3">{formatDateTime(h.endsAt)}</td>
            <td className="py-1.5">
              {h.refusal ? (
                <span className="text-refuse"><span className="font-semibold">waits for an engineering entry</span> — {h.refusal}</span>
              ) : h.newEndsAt && h.lengthenedMinutes > 0 ? (
                <span>{formatDateTime(h.newEndsAt)} <span className="font-semibold">(+{h.lengthenedMinutes} min)</span></span>
              ) : (
                <span className="text-ink-soft">unchanged</span>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** A data logger's CSV read against the order's running holds, previewed, then applied; the logs shown with the cure bands. */
export function TemperatureLogCard({ order }: { order: WorkOrderDto }) {
  const { data: me } = useQuery(authQueries.me());
  const logs = useQuery({ ...temperatureLogQueries.list(order.id), enabled: MAY_HAVE_LOGS.includes(order.state) });
  const read = useReadTemperatureLog(order.id);
  const apply = useApplyTemperatureLog();
  const [file, setFile] = useState<File | null>(null);
  const inputId = useId();
  const list = logs.data ?? [];
  const loggable = LOGGABLE.includes(order.state);
  if (!loggable && !list.length) return null;
  const mayLog = loggable && may(me, 'holds.temperatureLog');

  const applied = list.filter((l) => l.status === 'applied');
  // The log just read, else the latest log if it is not applied yet (an older preview was passed over);
  // with no preview, the latest applied log is plotted.
  const latest = list.at(-1);
  const justRead = read.data && list.find((l) => l.id === read.data.id)?.status !== 'applied' ? read.data : undefined;
  const preview = loggable ? (justRead ?? (latest?.status === 'previewed' ? latest : undefined)) : undefined;
  const plotted = preview ?? applied.at(-1);

  const label = new Map(order.jointTasks.map((t) => [t.id, t.label]));
  const markers: Marker[] = order.holds
    .filter((h) => h.kind === 'cure' && h.endsAt && h.status !== 'void')
    .map((h) => ({ key: h.id, at: Date.parse(h.endsAt!), label: `${(h.jointTaskId && label.get(h.jointTaskId)) || 'Joint'} cure end`, byLog: false }));
  for (const h of preview?.holds ?? []) {
    if (h.kind === 'cure' && h.newEndsAt && h.lengthenedMinutes > 0) markers.push({ key: `log-${h.holdId}`, at: Date.parse(h.newEndsAt), label: `${h.joint} cure end by the log`, byLog: true });
  }
  const merged = mergeMarkers(markers);

  return (
    <Card title="Temperature logs">
      <div className="space-y-3 text-sm">
        {mayLog && (
          <form
            className="flex flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              if (file) read.mutate(file, { onSuccess: () => apply.reset() });
            }}
          >
            <label htmlFor={inputId} className="flex min-w-0 flex-1 flex-col gap-1">
              <span className="font-medium">The data logger's CSV</span>
              <input
                id={inputId}
                type="file"
                accept=".csv,text/csv"
                className="min-h-11 rounded-lg border border-ink/20 bg-paper-raised px-2 py-2 file:mr-3 file:min-h-9 file:rounded-md file:border-0 file:bg-paper-sunk file:px-3 file:font-semibold"
                onChange={(e) => setFile(e.target.files?.[0] ?? null)}
              />
            </label>
            <Button size="lg" type="submit" disabled={!file || read.isPending}>{read.isPending ? 'Reading…' : 'Read the log'}</Button>
          </form>
        )}
        {read.error && <Notice tone="refusal" title="The log could not be read">{read.error.message}</Notice>}
        {logs.error && <Notice tone="refusal" title="The temperature logs could not be loaded">{logs.error.message}</Notice>}

        {preview && (
          <section aria-label={`Preview of ${preview.fileName}`} className="space-y-3 rounded-lg border border-ink/10 p-3">
            <p>
              <span className="font-semibold">{preview.fileName}</span>
              <span className="text-ink-soft"> · {plural(preview.readings.length, 'reading')} · {preview.unit ? `read in °${preview.unit}` : 'unit not named'} · read by {preview.uploadedBy.name} {formatDateTime(preview.uploadedAt)}</span>
            </p>
            {preview.problems.length > 0 && (
              <Notice tone="caution" title={`What the reader could not use (${preview.problems.length})`}>
                <ul className="list-disc pl-5">{preview.problems.map((p, i) => <li key={i}>{p}</li>)}</ul>
              </Notice>
            )}
            <PreviewHolds log={preview} />
            {mayLog && (
              <Button size="lg" onClick={() => apply.mutate(preview.id, { onSuccess: () => read.reset() })} disabled={apply.isPending}>
                {apply.isPending ? 'Applying…' : 'Apply to the holds'}
              </Button>
            )}
          </section>
        )}
        {apply.error && <Notice tone="refusal" title="Not applied">{apply.error.message}</Notice>}
        {apply.isSuccess && !preview && <Notice tone="success" title={`"${apply.data.fileName}" applied`}>The holds above show their ends by the log.</Notice>}

        {plotted && plotted.readings.length > 0 && <TemperaturePlot log={plotted} markers={merged} />}

        {applied.length > 0 && (
          <div>
            <h3 className="font-semibold">Applied</h3>
            <ul className="divide-y divide-ink/10">
              {applied.map((l) => (
                <li key={l.id} className="py-1.5">
                  {l.fileName} <span className="text-ink-soft">· {plural(l.readings.length, 'reading')} · applied {l.appliedAt ? formatDateTime(l.appliedAt) : ''}</span>
                </li>
              ))}
            </ul>
          </div>
        )}
      </div>
    </Card>
  );
}
