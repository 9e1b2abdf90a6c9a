import {
  agitationPoints,
  readingFigures,
  waterTestFigures,
  type JobDetail,
  type JobSheet,
  type RadiatorReadingInput,
  type WaterTestsInput,
} from '@heatfleet/domain';
import type { QueuedWrite } from '@/lib/offline/outbox';

/**
 * The job as the engineer left it: the server's last answer (or the phone's saved copy of it) with the writes still
 * waiting in the phone's queue laid over it, in the order they were tapped. So a reading kept without signal shows
 * on the sheet after a reload, a closed tab or a new page, until the server has it and the job is read again. The
 * figures are the domain's, the same the server computes.
 */
export function overlayQueued(detail: JobDetail, writes: readonly QueuedWrite[]): JobDetail {
  const prefix = `/api/jobs/${detail.job.id}/`;
  const mine = writes.filter((w) => w.state === 'waiting' && w.path.startsWith(prefix));
  if (mine.length === 0 || detail.job.status !== 'planned') return detail;
  let sheet = detail.sheet;
  for (const write of mine) sheet = applyWrite(sheet, write, write.path.slice(prefix.length));
  return { ...detail, sheet };
}

const readingPath = /^radiators\/(\d+)\/readings\/(before|after)$/;
const agitationPath = /^radiators\/(\d+)\/agitation$/;
const flushedPath = /^radiators\/(\d+)\/flushed$/;
const stepPath = /^steps\/([a-z_]+)$/;

function withRadiator(sheet: JobSheet, index: number, change: (r: JobSheet['radiators'][number]) => object): JobSheet {
  return {
    ...sheet,
    radiators: sheet.radiators.map((r) => (r.index === index ? { ...r, ...change(r) } : r)),
  };
}

function applyWrite(sheet: JobSheet, write: QueuedWrite, rest: string): JobSheet {
  const body = (write.body ?? {}) as Record<string, unknown>;
  let m = readingPath.exec(rest);
  if (m) {
    const input = body as unknown as RadiatorReadingInput;
    const phase = m[2] as 'before' | 'after';
    return withRadiator(sheet, Number(m[1]), (r) => ({
      [phase]: {
        topC: input.topC,
        bottomC: input.bottomC,
        flowC: input.flowC ?? null,
        returnC: input.returnC ?? null,
        roomC: input.roomC ?? null,
        ...readingFigures(input, r.ratedWatts, sheet.coldBottomThresholdK),
      },
    }));
  }
  m = agitationPath.exec(rest);
  if (m) {
    const minutes = Number(body.minutes);
    const kitItemId = typeof body.kitItemId === 'number' ? body.kitItemId : null;
    const tool = sheet.kitOnVan.find((k) => k.id === kitItemId);
    const magnitudeMs2 = tool?.vibrationMs2 ?? null;
    return withRadiator(sheet, Number(m[1]), () => ({
      agitation: {
        minutes,
        kitItemId,
        kitItemTag: tool?.assetTag ?? null,
        magnitudeMs2,
        points: agitationPoints(magnitudeMs2, minutes),
      },
    }));
  }
  m = flushedPath.exec(rest);
  if (m) {
    const done = body.done === true;
    return withRadiator(sheet, Number(m[1]), (r) => ({ flushedAt: done ? (r.flushedAt ?? write.tappedAt) : null }));
  }
  m = stepPath.exec(rest);
  if (m) {
    const done = body.done === true;
    return {
      ...sheet,
      steps: sheet.steps.map((s) =>
        s.step === m![1]
          ? { ...s, doneAt: done ? (s.doneAt ?? write.tappedAt) : null, doneByName: done ? s.doneByName : null }
          : s,
      ),
    };
  }
  if (rest === 'water-tests') {
    const input = body as WaterTestsInput;
    const w = {
      mainsTdsPpm: input.mainsTdsPpm ?? null,
      systemTdsPpm: input.systemTdsPpm ?? null,
      waterClear: input.waterClear ?? null,
      inhibitorReading: input.inhibitorReading ?? null,
      inhibitorProductId: input.inhibitorProductId ?? null,
      ph: input.ph ?? null,
    };
    const range = sheet.water.figures.inhibitor;
    return { ...sheet, water: { ...w, figures: waterTestFigures(w, range) } };
  }
  // Its save raises the version by one, so a later save made on this phone is written from it.
  if (rest === 'notes') return { ...sheet, notes: String(body.notes ?? ''), notesVersion: sheet.notesVersion + 1 };
  if (rest === 'kit' && Array.isArray(body.kitItemIds)) {
    const ids = new Set(body.kitItemIds as number[]);
    const known = [...sheet.kitUsed, ...sheet.kitOnVan].filter(
      (k, i, all) => all.findIndex((x) => x.id === k.id) === i,
    );
    return {
      ...sheet,
      kitUsed: known
        .filter((k) => ids.has(k.id))
        .map((k) => ({ id: k.id, assetTag: k.assetTag, kindName: k.kindName, kitName: k.kitName })),
    };
  }
  if (rest === 'photos' && write.form) {
    // Not on the server yet: no id and no address; the photos list shows it as waiting.
    const photo = {
      id: -Number(write.seq.replace(/\D/g, '').slice(-9)),
      url: '',
      tag: write.form.fields.tag ?? 'other',
      caption: write.form.fields.caption ?? null,
      contentType: 'image/jpeg',
      createdAt: write.tappedAt,
    };
    return { ...sheet, photos: [...sheet.photos, photo as JobSheet['photos'][number]] };
  }
  if (rest === 'signatures') {
    const kind = body.kind as JobSheet['signatures'][number]['kind'];
    // The drawn PNG itself stands in for the stored one until the server has it.
    const signature = {
      kind,
      name: String(body.name ?? ''),
      signedAt: write.tappedAt,
      url: String(body.imagePngDataUrl ?? ''),
    };
    return { ...sheet, signatures: [...sheet.signatures.filter((s) => s.kind !== kind), signature] };
  }
  return sheet;
}
