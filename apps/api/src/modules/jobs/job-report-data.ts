import type { Readable } from 'node:stream';
import { cisternConditionLabels, DEFAULT_TIME_ZONE, type JobDetail, type VisitKind } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { AppDeps } from '../../app-deps.ts';
import { findReportFirm, findTestMethod, listReportChemicals, listSignatureObjects } from './job-report-dal.ts';
import { listJobPhotoObjects } from './job-sheet-dal.ts';

/** A picture for a report: JPEG and PNG are drawn; pdfkit cannot draw WebP, so it is listed. */
export interface ReportPhoto {
  tag: string | null;
  caption: string | null;
  contentType: string;
  image: Buffer | null;
}

export interface ReportSignature {
  kind: 'acknowledgement' | 'acceptance';
  name: string;
  signedAt: string;
  image: Buffer | null;
}

/** Everything either report prints, loaded once: the job as the API answers it, and what only the reports need. */
export interface ReportData {
  detail: JobDetail;
  firm: {
    name: string;
    address: string | null;
    phone: string | null;
    email: string | null;
    registrationNumbers: string | null;
    timeZone: string;
  };
  /** The firm's number for this job's report (per firm sequence), given at completion; a draft's says so. */
  reportNumber: string;
  engineerName: string | null;
  visitKind: VisitKind;
  system: {
    boilerMake: string | null;
    boilerModel: string | null;
    boilerLocation: string | null;
    magneticFilterFitted: boolean | null;
    cisternCondition: string | null;
  };
  chemicals: {
    product: string;
    kind: string;
    packSizeMl: number;
    lotNumber: string;
    expiresOn: string;
    packs: number;
  }[];
  inhibitorTestMethod: string | null;
  photos: ReportPhoto[];
  signatures: ReportSignature[];
  /** Reasons the engineer gave at completion for what was not done, with what was found. */
  reasons: { code: string; label: string; found: string; reason: string }[];
  /** What the engineer recommends, in their words (given at completion), if they wrote any. */
  recommendation: string | null;
}

async function readAll(stream: Readable): Promise<Buffer> {
  const parts: Buffer[] = [];
  for await (const part of stream) parts.push(Buffer.isBuffer(part) ? part : Buffer.from(part as Uint8Array));
  return Buffer.concat(parts);
}

/** An image from object storage, or null: a picture storage cannot give back is listed, not fatal. */
async function readImage(deps: AppDeps, key: string, contentType: string): Promise<Buffer | null> {
  if (contentType !== 'image/jpeg' && contentType !== 'image/png') return null;
  try {
    return await readAll(await deps.objectStore.get(key));
  } catch (err) {
    deps.logger.warn({ err, key }, 'image left out of the report: object storage did not return it');
    return null;
  }
}

/** The report's data, read through `db` (the completion's transaction, if any). */
export async function loadReportData(
  deps: AppDeps,
  db: Knex | Knex.Transaction,
  firmId: number,
  detail: JobDetail,
): Promise<ReportData> {
  const { job, sheet } = detail;
  const [firm, photoRows, signatureRows, chemicals, inhibitorTestMethod] = await Promise.all([
    findReportFirm(db, firmId),
    listJobPhotoObjects(db, firmId, job.id),
    listSignatureObjects(db, firmId, job.id),
    listReportChemicals(db, firmId, job.id),
    sheet.water.inhibitorProductId ? findTestMethod(db, firmId, sheet.water.inhibitorProductId) : null,
  ]);
  const photos = await Promise.all(
    photoRows.map(async (r): Promise<ReportPhoto> => ({
      tag: r.tag,
      caption: r.caption,
      contentType: r.content_type,
      image: await readImage(deps, r.object_key, r.content_type),
    })),
  );
  const signatures = await Promise.all(
    sheet.signatures.map(async (sig): Promise<ReportSignature> => {
      const key = signatureRows.find((r) => r.kind === sig.kind)?.object_key;
      return { ...sig, image: key ? await readImage(deps, key, 'image/png') : null };
    }),
  );
  const { systemDetails: system } = job;
  return {
    detail,
    firm: {
      name: firm?.name ?? '',
      address: firm?.address ?? null,
      phone: firm?.phone ?? null,
      email: firm?.email ?? null,
      registrationNumbers: firm?.registration_numbers ?? null,
      timeZone: firm?.time_zone ?? DEFAULT_TIME_ZONE,
    },
    reportNumber: job.reportNumber ?? `draft (job ${job.id}, not completed)`,
    engineerName: job.engineerName,
    visitKind: job.visitKind,
    system: {
      ...system,
      cisternCondition: system.cisternCondition && cisternConditionLabels[system.cisternCondition],
    },
    chemicals: chemicals.map((c) => ({
      product: c.product,
      kind: c.kind,
      packSizeMl: Number(c.pack_size_ml),
      lotNumber: c.lot_number,
      expiresOn: c.expires_on,
      packs: Number(c.packs),
    })),
    inhibitorTestMethod,
    photos,
    signatures,
    reasons: job.completionReasons,
    recommendation: job.recommendation,
  };
}
