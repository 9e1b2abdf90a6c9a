import { ForbiddenError } from '@casl/ability';
import type { ReminderDelivery, ReminderSettings, ReminderSettingsView } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { listReminderDeliveries } from './reminder-dal.ts';
import { findReminderSettings, saveReminderSettings } from './reminder-settings-dal.ts';
import { runReminderScan } from './reminder-scan.ts';

// The page shows recent history; older deliveries stay in the table for anyone who queries it.
const LIST_LIMIT = 500;

export async function listReminders(deps: AppDeps, actor: Actor): Promise<ReminderDelivery[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Reminder');
  return listReminderDeliveries(deps.db, actor.firmId, LIST_LIMIT);
}

export async function getReminderSettings(deps: AppDeps, actor: Actor): Promise<ReminderSettingsView> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'ReminderSettings');
  return findReminderSettings(deps.db, actor.firmId);
}

export async function updateReminderSettings(
  deps: AppDeps,
  actor: Actor,
  input: ReminderSettings,
): Promise<ReminderSettingsView> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'ReminderSettings');
  await saveReminderSettings(deps.db, actor.firmId, input);
  return findReminderSettings(deps.db, actor.firmId);
}

/** "Scan now": the firm's scan at once; anything already reminded for its period is not sent again. */
export async function scanRemindersNow(deps: AppDeps, actor: Actor): Promise<number> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Reminder');
  const result = await runReminderScan(deps, actor.firmId, deps.clock.now());
  return result.reminders;
}
