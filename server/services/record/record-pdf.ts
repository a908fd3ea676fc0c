// The order's record as a PDF (pdfkit): the order and its lines, each joint with who made each step
// and when, the primer and cement lots, the conditions, its photos, its holds and how they ended,
// and a QR code that opens the joint's page; then the locks, the verification, the tests and the
// release. Fonts are the app's own Inter Tight .woff files (a .woff2 breaks pdfkit), latin and
// latin-ext registered apart, switched per text for the characters only latin-ext holds.

import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';
import { Op } from 'sequelize';
import { config } from '@server/config';
import { Hold, JointStepRecord, Photo } from '@server/db/models/joint-record';
import { IsolationVerification, Lock, LockBox } from '@server/db/models/lockout';
import { PressureTest, Release } from '@server/db/models/release';
import { AppError } from '@server/errors';
import { namesOf } from '@server/services/lockout/board';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import { loadFacts } from '@server/services/work-orders/order-facts';
import { plantTime } from '@server/services/work-orders/plant-time';
import { FITTING_KIND_LABELS } from '@shared/schemas/joint-tasks';
import { JOINT_STEP_LABELS, JOINT_STEPS } from '@shared/schemas/joint-steps';
import { WORK_ORDER_STATE_LABELS, type WorkOrderState } from '@shared/schemas/work-orders';
import { DEFERENCE } from '@shared/trade';

const require = createRequire(import.meta.url);
const font = (subset: string, weight: number) => require.resolve(`@fontsource/inter-tight/files/inter-tight-${subset}-${weight}-normal.woff`);
const FONTS = { regular: font('latin', 400), bold: font('latin', 700), regularExt: font('latin-ext', 400), boldExt: font('latin-ext', 700) };
/** Characters the latin subset lacks but latin-ext has (ő, ł, č …); ≥, ≤ and ✓ are written as words. */
const NEEDS_EXT = /[\u0100-\u024F\u1E00-\u1EFF]/;

type Doc = InstanceType<typeof PDFDocument>;
const MARGIN = 48;

function text(doc: Doc, s: string, opts: { bold?: boolean; size?: number; gap?: number; color?: string; width?: number } = {}) {
  const ext = NEEDS_EXT.test(s);
  doc.font(opts.bold ? (ext ? 'boldExt' : 'bold') : ext ? 'regularExt' : 'regular').fontSize(opts.size ?? 10).fillColor(opts.color ?? '#1d2731');
  doc.text(s.replace(/≥\s?/g, 'at least ').replace(/≤\s?/g, 'up to ').replace(/✓/g, 'yes'), { width: opts.width ?? doc.page.width - 2 * MARGIN });
  if (opts.gap) doc.moveDown(opts.gap);
}

const heading = (doc: Doc, s: string) => {
  if (doc.y > doc.page.height - 140) doc.addPage();
  doc.moveDown(0.6);
  text(doc, s, { bold: true, size: 13, gap: 0.2 });
};

/** Renders the record; 409 unless the order has been released. */
export async function orderRecordPdf(orderId: string): Promise<{ filename: string; pdf: Buffer }> {
  const facts = await loadFacts(orderId);
  const { order } = facts;
  if (order.state !== 'released' && order.state !== 'closed') {
    throw AppError.conflict(`${order.number} is ${WORK_ORDER_STATE_LABELS[order.state as WorkOrderState].toLowerCase()}; its record is printed once its lines are released.`);
  }
  const plant = await currentPlantSettings();
  const at = (d: Date | string | null | undefined) => (d ? plantTime(d, plant.timeZone) : '—');
  const ids = facts.joints.map((j) => j.id);
  const [steps, photos, holds, locks, box, verifications, tests, release] = await Promise.all([
    JointStepRecord.findAll({ where: { jointTaskId: { [Op.in]: ids } }, order: [['recordedAt', 'ASC']] }),
    Photo.findAll({ where: { jointTaskId: { [Op.in]: ids } }, order: [['createdAt', 'ASC']] }),
    Hold.findAll({ where: { workOrderId: order.id }, order: [['createdAt', 'ASC']] }),
    Lock.findAll({ where: { workOrderId: order.id }, order: [['appliedAt', 'ASC']] }),
    LockBox.findOne({ where: { workOrderId: order.id } }),
    IsolationVerification.findAll({ where: { workOrderId: order.id }, order: [['verifiedAt', 'ASC']] }),
    PressureTest.findAll({ where: { workOrderId: order.id }, order: [['recordedAt', 'ASC']] }),
    Release.findOne({ where: { workOrderId: order.id } }),
  ]);
  const names = await namesOf([
    ...steps.map((s) => s.recordedById), ...locks.flatMap((l) => [l.personId, l.removedById]), ...verifications.map((v) => v.verifiedById),
    ...tests.map((x) => x.witnessId), release?.releasedById, ...holds.map((h) => h.engineeringById), ...facts.joints.map((j) => j.redoneById),
  ]);
  const who = (id: string | null | undefined) => (id ? (names.get(id) ?? 'someone no longer listed') : '—');

  const doc = new PDFDocument({ size: 'A4', margin: MARGIN, info: { Title: `${order.number} record`, Author: 'Linewright' } });
  doc.registerFont('regular', FONTS.regular).registerFont('bold', FONTS.bold).registerFont('regularExt', FONTS.regularExt).registerFont('boldExt', FONTS.boldExt);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));

  text(doc, `${order.number} — record of the work`, { bold: true, size: 18, gap: 0.2 });
  text(doc, `${order.kind} · ${order.priority} · state ${WORK_ORDER_STATE_LABELS[order.state as WorkOrderState].toLowerCase()} · printed ${at(new Date())}`, { color: '#3d4a57', gap: 0.4 });
  text(doc, order.scope, { gap: 0.3 });
  for (const l of facts.lines) text(doc, `Line ${l.lineNumber}: ${l.service}, ${l.material} ${l.schedule ? `Sch ${l.schedule}` : `SDR ${l.sdr}`}, ${l.nominalSize}", design ${l.designPressurePsi} psi at ${l.designTemperatureF} °F, area ${l.area}`);
  text(doc, `Window ${at(order.windowStart)} to ${at(order.windowEnd)} · requested by ${order.requestedBy}`, { gap: 0.2 });

  heading(doc, 'Isolation and locks (OSHA 29 CFR 1910.147)');
  if (box) text(doc, `Group lock box ${box.label}, primary responsibility ${who(box.responsiblePersonId)}.`);
  for (const e of facts.plan) {
    const on = locks.filter((l) => l.isolationPlanEntryId === e.id);
    text(doc, `${e.tag} (${e.kind}, ${e.lineNumber}) — must be ${e.requiredPosition}${e.lockBoxId ? ', key in the lock box' : ''}`, { bold: true });
    for (const l of on) text(doc, `   lock ${l.lockNumber}: ${who(l.personId)}, on ${at(l.appliedAt)}, off ${at(l.removedAt)} by ${who(l.removedById)}${l.removal === 'absent' ? ' under the (e)(3) procedure' : ''}`);
  }
  for (const l of locks.filter((x) => x.lockBoxId)) text(doc, `   lock ${l.lockNumber} on the box: ${who(l.personId)}, on ${at(l.appliedAt)}, off ${at(l.removedAt)} by ${who(l.removedById)}`);
  for (const v of verifications) text(doc, `Zero energy verified by ${who(v.verifiedById)} at ${at(v.verifiedAt)}: ${v.method} Reading: ${v.reading}`, { gap: 0.1 });

  for (const j of facts.joints) {
    heading(doc, `Joint ${j.label} — ${FITTING_KIND_LABELS[j.fittingKind]}, ${j.jointSize}" on ${j.lineNumber}`);
    const qr = await QRCode.toBuffer(`${config.origin}/joints/${j.id}`, { margin: 1, width: 160 });
    const top = doc.y;
    const beside = doc.page.width - 2 * MARGIN - 84; // the text keeps clear of the QR code
    doc.image(qr, doc.page.width - MARGIN - 72, top, { width: 72 });
    if (j.redoneAt) text(doc, `Cut out for redo at ${at(j.redoneAt)} by ${who(j.redoneById)}: ${j.redoReason}`, { color: '#a61f15', width: beside });
    if (j.replacesTaskId) text(doc, `Replaces ${facts.joints.find((x) => x.id === j.replacesTaskId)?.label ?? 'a joint cut out'}.`, { width: beside });
    for (const step of JOINT_STEPS) {
      const r = steps.find((s) => s.jointTaskId === j.id && s.step === step);
      const v = (r?.values ?? {}) as Record<string, unknown>;
      const detail = step === 'primer' ? ` — ${String(v.standard)} lot ${String(v.lot)}`
        : step === 'cement' ? ` — ${String(v.standard)} lot ${String(v.lot)}, made ${String(v.manufacturedOn)}; ${String(v.temperatureF)} °F, ${String(v.relativeHumidity)} % RH`
        : step === 'dry-fit' ? ` — entered ${String(v.insertionIn)} in of a ${String(v.socketDepthIn)} in socket`
        : step === 'assembly' ? ` — held ${String(v.heldSeconds)} s${v.joiningDeviceUsed ? ', joining device used' : ''}` : '';
      text(doc, r ? `${JOINT_STEP_LABELS[step]}: ${who(r.recordedById)}, ${at(r.recordedAt)}${detail}` : `${JOINT_STEP_LABELS[step]}: not recorded`, { width: beside });
    }
    for (const h of holds.filter((x) => x.jointTaskId === j.id)) {
      const end = h.status === 'ended' ? `ended ${at(h.endedAt)} (${h.endedBy})` : h.status === 'void' ? `void: ${h.voidReason}` : h.status;
      text(doc, `${h.kind === 'set' ? 'Set' : 'Cure'} hold ${at(h.startsAt)} to ${at(h.endsAt)} at ${h.temperatureF} °F, ${h.relativeHumidity} % RH, ${h.pressurePsi} psi: ${h.basis}; ${end}`, { size: 9, color: '#3d4a57', width: beside });
    }
    if (doc.y < top + 80) doc.y = top + 80;
    const mine = photos.filter((p) => p.jointTaskId === j.id);
    if (mine.length) {
      if (doc.y > doc.page.height - 200) doc.addPage();
      let x = MARGIN;
      const y = doc.y + 4;
      for (const p of mine.slice(0, 4)) {
        doc.image(p.content, x, y, { fit: [115, 115] });
        x += 123;
      }
      doc.y = y + 120;
      doc.x = MARGIN;
    }
  }

  heading(doc, 'Hydrostatic test (ASME B31.3 345.2.7)');
  if (!tests.length) text(doc, 'No test recorded.');
  for (const x of tests) {
    text(doc, `${x.result === 'passed' ? 'Passed' : 'Failed'} — ${x.medium} at ${x.testPressurePsi} psi, gauge ${x.gauge}; ${x.startReadingPsi} psi at ${at(x.startedAt)}, ${x.endReadingPsi} psi at ${at(x.endedAt)}`, { bold: true });
    text(doc, `Piping: ${x.pipingIdentified}. Examiner: ${x.examiner}. Witness: ${who(x.witnessId)}.${x.notes ? ` ${x.notes}` : ''}`, { gap: 0.2 });
  }

  heading(doc, 'Release');
  if (release) {
    text(doc, `Released by ${who(release.releasedById)} at ${at(release.releasedAt)}: area inspected, people clear, affected people told, vents and drains set, slow refill.${release.notes ? ` ${release.notes}` : ''}`);
  } else text(doc, 'Not released.');
  doc.moveDown(1);
  text(doc, DEFERENCE, { size: 8, color: '#566270' });
  doc.end();
  return { filename: `${order.number}-record.pdf`, pdf: await done };
}
