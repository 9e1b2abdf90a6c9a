import type { Readable } from 'node:stream';
import { ForbiddenError } from '@casl/ability';
import { DEFAULT_TIME_ZONE, type JobDetail } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { findFirm } from '../firms/firm-dal.ts';
import { renderJobReport, type ReportPhoto } from './job-report.ts';
import { listJobPhotoObjects, memberName } from './job-sheet-dal.ts';
import { getJob } from './job-service.ts';

async function readAll(stream: Readable): Promise<Buffer> {
  const parts: Buffer[] = [];
  for await (const part of stream) parts.push(Buffer.isBuffer(part) ? part : Buffer.from(part as Uint8Array));
  return Buffer.concat(parts);
}

/** The report with the firm, the job's engineer and its photos looked up, read through `db` (the completion's transaction, if any). */
export async function renderReportFor(
  deps: AppDeps,
  db: Knex | Knex.Transaction,
  firmId: number,
  detail: JobDetail,
): Promise<Buffer> {
  const [firm, engineerName, rows] = await Promise.all([
    findFirm(db, firmId),
    detail.job.engineerMemberId ? memberName(db, firmId, detail.job.engineerMemberId) : null,
    listJobPhotoObjects(db, firmId, detail.job.id),
  ]);
  const photos = await Promise.all(
    rows.map(async (r): Promise<ReportPhoto> => {
      const drawable = r.content_type === 'image/jpeg' || r.content_type === 'image/png';
      let image: Buffer | null = null;
      if (drawable) {
        // A photo storage cannot give back is listed, not fatal: the report still goes out.
        try {
          image = await readAll(await deps.objectStore.get(r.object_key));
        } catch (err) {
          deps.logger.warn(
            { err, key: r.object_key },
            'job photo left out of the report: object storage did not return it',
          );
        }
      }
      return { tag: r.tag, caption: r.caption, contentType: r.content_type, image };
    }),
  );
  return renderJobReport(detail, {
    firmName: firm?.name ?? '',
    engineerName,
    timeZone: firm?.time_zone ?? DEFAULT_TIME_ZONE,
    photos,
  });
}

/** The completion report of a job as a PDF, for download. */
export async function jobReportPdf(deps: AppDeps, actor: Actor, jobId: number): Promise<Buffer> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Job');
  return renderReportFor(deps, deps.db, actor.firmId, await getJob(deps, actor, jobId));
}
