import type { Knex } from 'knex';
import type { Logger } from 'pino';
import {
  ANNUAL_CHECK_WINDOW_DAYS,
  calendarDateIn,
  daysBetween,
  formatUkCalendarDate as day,
  inspectionDue,
  VAN_DUE_WINDOW_DAYS,
  type CalendarDate,
} from '@heatfleet/domain';
import type { Env } from '../../config/env.ts';
import { insertEmail } from '../mail/mail-dal.ts';
import type { MailQueue } from '../mail/mail-queue.ts';
import { insertReminderDeliveries, insertReminderIfNew, type NewReminder } from './reminder-dal.ts';
import {
  listActiveMembers,
  listItemsForScan,
  listSitesForScan,
  listVansForScan,
  type ItemForScan,
  type Recipient,
  type SiteForScan,
  type VanForScan,
} from './reminder-scan-dal.ts';
import {
  ensureReminderSettingsRow,
  listFirmsToScan,
  lockFirmForScan,
  markFirmScanned,
  type FirmToScan,
} from './reminder-settings-dal.ts';
import { annualCheckCustomerEmail, reminderDigestEmail, type DigestLine } from './reminder-email.ts';
import { stockCandidates } from './reminder-stock.ts';
import { overdueInvoiceCandidates, overdueInvoiceEmail } from '../money/invoice-reminders.ts';
import { createUnsubscribeLink, mayMarketTo } from './unsubscribe-service.ts';

/** What a scan needs; AppDeps has all of it, and the worker builds the same from its own parts. */
export interface ReminderScanDeps {
  db: Knex;
  mailQueue: MailQueue;
  env: Pick<Env, 'APP_ORIGIN'>;
  logger?: Logger;
}

export interface ScanResult {
  /** Reminders new in this scan (each is sent once, whoever it went to). */
  reminders: number;
  emails: number;
  /** False when the sweep found the firm already scanned today (or the firm is gone). */
  ran: boolean;
}

/** A reminder found by this scan, with whose van it concerns (for the engineer's own digest). */
interface Candidate extends NewReminder {
  vanEngineerMemberId: number | null;
  /** For an annual check: the customer to tell too, where the firm has turned that on. */
  customer?: { name: string; email: string | null; address: string; dueOn: string };
}

/** The hour of the day (0 to 23) an instant falls in, in a time zone. */
export function hourIn(instant: Date, timeZone: string): number {
  const hour = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', hourCycle: 'h23' }).format(instant);
  return Number(hour);
}

/** Whether the sweep should scan this firm now: its scan hour has come today and today has not been scanned. */
export function firmIsDueForScan(firm: FirmToScan, now: Date): boolean {
  const today = calendarDateIn(now, firm.timeZone);
  if (firm.settings.lastScanOn !== null && firm.settings.lastScanOn >= today) return false;
  return hourIn(now, firm.timeZone) >= firm.settings.scanHour;
}

function itemLabel(item: ItemForScan): string {
  return `${item.assetTag} (${item.kindName}${item.locationName ? `, on ${item.locationName}` : ''})`;
}

function inspectionCandidates(items: ItemForScan[], today: CalendarDate): Candidate[] {
  const found: Candidate[] = [];
  for (const item of items) {
    const due = inspectionDue(
      { intervalDays: item.intervalDays, intervalUses: item.intervalUses, dueSoonDays: item.dueSoonDays },
      {
        lastInspectedOn: item.lastInspectedOn,
        inServiceSince: item.inServiceSince,
        usesSinceInspection: item.usesSinceInspection,
      },
      today,
    );
    if (due.state !== 'due_soon' && due.state !== 'overdue') continue;
    let periodKey: string;
    let why: string;
    if (due.reason === 'uses') {
      // A use-based period ends with the next inspection, so the count of inspections names it.
      periodKey = `uses:${item.inspectionCount}`;
      why =
        due.state === 'overdue'
          ? `inspection overdue: used ${item.usesSinceInspection} times since the last one (rule: every ${item.intervalUses} uses)`
          : `inspection due after ${due.usesLeft === 1 ? 'its next use' : `${due.usesLeft} more uses`} (rule: every ${item.intervalUses} uses)`;
    } else if (due.dueOn !== null) {
      periodKey = due.dueOn;
      why =
        due.state === 'overdue' ? `inspection overdue since ${day(due.dueOn)}` : `inspection due by ${day(due.dueOn)}`;
    } else {
      continue;
    }
    found.push({
      kind: 'inspection_due',
      subjectType: 'kit_item',
      subjectId: item.id,
      periodKey,
      summary: `${itemLabel(item)}: ${why}`,
      vanEngineerMemberId: item.vanEngineerMemberId,
    });
  }
  return found;
}

function vanCandidates(vans: VanForScan[], today: CalendarDate): Candidate[] {
  const found: Candidate[] = [];
  for (const van of vans) {
    const label = van.registration ? `${van.name} (${van.registration})` : van.name;
    const dates = [
      { kind: 'mot_due' as const, dueOn: van.motDueOn, what: 'MOT' },
      { kind: 'service_due' as const, dueOn: van.serviceDueOn, what: 'service' },
    ];
    for (const { kind, dueOn, what } of dates) {
      if (dueOn === null) continue;
      const daysLeft = daysBetween(today, dueOn);
      if (daysLeft > VAN_DUE_WINDOW_DAYS) continue;
      found.push({
        kind,
        subjectType: 'van',
        subjectId: van.id,
        periodKey: dueOn,
        summary: `${label}: ${what} ${daysLeft < 0 ? `overdue since ${day(dueOn)}` : `due on ${day(dueOn)}`}`,
        vanEngineerMemberId: van.engineerMemberId,
      });
    }
  }
  return found;
}

/** Sites whose annual inhibitor check falls within the window, or has passed: for the office. */
function annualCheckCandidates(sites: SiteForScan[], today: CalendarDate): Candidate[] {
  const found: Candidate[] = [];
  for (const site of sites) {
    const daysLeft = daysBetween(today, site.nextCheckOn);
    if (daysLeft > ANNUAL_CHECK_WINDOW_DAYS) continue;
    found.push({
      kind: 'annual_check_due',
      subjectType: 'site',
      subjectId: site.id,
      periodKey: site.nextCheckOn,
      summary: `${site.customerName}, ${site.address}: annual inhibitor check ${daysLeft < 0 ? `overdue since ${day(site.nextCheckOn)}` : `due on ${day(site.nextCheckOn)}`}`,
      vanEngineerMemberId: null,
      customer: { name: site.customerName, email: site.customerEmail, address: site.address, dueOn: site.nextCheckOn },
    });
  }
  return found;
}

interface Digest {
  recipient: Recipient;
  audience: { kind: 'office' } | { kind: 'engineer'; name: string };
  reminders: (Candidate & { id: number })[];
}

/**
 * The office digest goes to the active Owner and Stores members; each engineer whose van (its kit,
 * its dates or its stock under minimum) has something new gets a digest of just that. Someone in the
 * office set already sees it all.
 */
function planDigests(fresh: (Candidate & { id: number })[], members: Recipient[]): Digest[] {
  const office = members.filter((m) => m.role === 'owner' || m.role === 'stores');
  const officeIds = new Set(office.map((m) => m.memberId));
  const digests: Digest[] = office.map((recipient) => ({ recipient, audience: { kind: 'office' }, reminders: fresh }));
  for (const member of members) {
    if (officeIds.has(member.memberId)) continue;
    const own = fresh.filter((r) => r.vanEngineerMemberId === member.memberId);
    if (own.length > 0)
      digests.push({ recipient: member, audience: { kind: 'engineer', name: member.name }, reminders: own });
  }
  return digests.filter((d) => d.reminders.length > 0);
}

/**
 * One firm's scan at `now` (the clock is the caller's, so tests move time). The reminder rows, the
 * digest e-mails and the delivery records are written in one transaction that holds the firm's
 * settings row; a reminder already recorded for its period is never sent again, so a repeated,
 * duplicated or racing scan sends nothing twice. `sweep` scans only if today was not scanned yet,
 * and records today as scanned; a scan asked for by a person (the button) runs regardless and leaves
 * the day's scheduled scan to run later.
 */
export async function runReminderScan(
  deps: ReminderScanDeps,
  firmId: number,
  now: Date,
  options: { sweep?: boolean } = {},
): Promise<ScanResult> {
  await ensureReminderSettingsRow(deps.db, firmId);
  const outcome = await deps.db.transaction(async (trx) => {
    const firm = await lockFirmForScan(trx, firmId);
    if (!firm) return { reminders: 0, emailIds: [] as number[], ran: false };
    if (options.sweep && !firmIsDueForScan(firm, now)) return { reminders: 0, emailIds: [] as number[], ran: false };
    const today = calendarDateIn(now, firm.timeZone);

    const candidates = [
      ...(firm.settings.inspectionReminders ? inspectionCandidates(await listItemsForScan(trx, firmId), today) : []),
      ...(firm.settings.vanReminders ? vanCandidates(await listVansForScan(trx, firmId), today) : []),
      ...(firm.settings.stockReminders ? await stockCandidates(trx, firmId, today, now) : []),
      ...(firm.settings.annualCheckReminders ? annualCheckCandidates(await listSitesForScan(trx, firmId), today) : []),
      // Overdue invoices, at the firm's money settings' days after the due date (modules/money).
      ...(await overdueInvoiceCandidates(trx, firmId, today)),
    ];
    const fresh: (Candidate & { id: number })[] = [];
    for (const candidate of candidates) {
      const id = await insertReminderIfNew(trx, firmId, candidate);
      if (id !== undefined) fresh.push({ ...candidate, id });
    }

    const emailIds: number[] = [];
    if (fresh.length > 0) {
      const link = new URL('/reminders', deps.env.APP_ORIGIN).toString();
      for (const digest of planDigests(fresh, await listActiveMembers(trx, firmId))) {
        const lines: DigestLine[] = digest.reminders.map((r) => ({ kind: r.kind, summary: r.summary }));
        const email = reminderDigestEmail({ firmName: firm.name, audience: digest.audience, lines, link });
        const emailId = await insertEmail(trx, { firmId, to: digest.recipient.email, ...email, purpose: 'reminder' });
        emailIds.push(emailId);
        await insertReminderDeliveries(
          trx,
          firmId,
          digest.reminders.map((r) => ({ reminderId: r.id, emailId, recipient: digest.recipient.email })),
        );
      }
    }
    if (firm.settings.annualCheckCustomerEmails) {
      for (const r of fresh) {
        if (r.kind !== 'annual_check_due' || !r.customer?.email) continue;
        // The offer of a paid visit is direct marketing: never to an address on the firm's suppression list, and
        // each message carries its own unsubscribe link (PECR 2003 regulation 22).
        if (!(await mayMarketTo(trx, firmId, r.customer.email))) continue;
        const email = annualCheckCustomerEmail({
          firmName: firm.name,
          customerName: r.customer.name,
          address: r.customer.address,
          dueOn: r.customer.dueOn,
          unsubscribeLink: await createUnsubscribeLink(trx, firmId, r.customer.email, deps.env.APP_ORIGIN),
        });
        const emailId = await insertEmail(trx, { firmId, to: r.customer.email, ...email, purpose: 'reminder' });
        emailIds.push(emailId);
        await insertReminderDeliveries(trx, firmId, [{ reminderId: r.id, emailId, recipient: r.customer.email }]);
      }
    }
    // The customer's own reminder for each overdue invoice newly recorded (once per invoice per chase).
    for (const r of fresh) {
      if (r.kind !== 'invoice_overdue') continue;
      const sent = await overdueInvoiceEmail(trx, deps.env.APP_ORIGIN, firmId, r.subjectId, r.periodKey, now);
      if (!sent) continue;
      emailIds.push(sent.emailId);
      await insertReminderDeliveries(trx, firmId, [{ reminderId: r.id, emailId: sent.emailId, recipient: sent.to }]);
    }
    if (options.sweep) await markFirmScanned(trx, firmId, today);
    return { reminders: fresh.length, emailIds, ran: true };
  });
  if (outcome.emailIds.length > 0) await deps.mailQueue.notify(outcome.emailIds);
  return { reminders: outcome.reminders, emails: outcome.emailIds.length, ran: outcome.ran };
}

/**
 * The hourly sweep: every firm whose scan hour has come today (in its own time zone) and that has
 * not been scanned today. A sweep missed while the worker was down is caught up by the next one.
 * `firmIds` narrows it (tests share one database with other test files).
 */
export async function runDueScans(
  deps: ReminderScanDeps,
  now: Date,
  firmIds?: number[],
): Promise<{ firms: number; reminders: number }> {
  let firms = 0;
  let reminders = 0;
  for (const firm of await listFirmsToScan(deps.db, firmIds)) {
    if (!firmIsDueForScan(firm, now)) continue;
    try {
      const result = await runReminderScan(deps, firm.id, now, { sweep: true });
      if (result.ran) firms += 1;
      reminders += result.reminders;
    } catch (err) {
      // One firm's bad data must not hold up every other firm's reminders; the next sweep retries it.
      deps.logger?.error({ err, firmId: firm.id }, 'reminder scan failed');
    }
  }
  return { firms, reminders };
}
