import {
  reminderListResponseSchema,
  reminderScanResponseSchema,
  reminderSettingsResponseSchema,
  reminderSettingsSchema,
} from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { getReminderSettings, listReminders, scanRemindersNow, updateReminderSettings } from './reminder-service.ts';

export const reminderRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/reminders',
    tag: 'Reminders',
    access: 'member',
    tenantData: true,
    summary: 'Reminders sent, to whom and why, newest first (Owner, Admin, Stores)',
    request: {},
    responses: { 200: { description: 'Deliveries', schema: reminderListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ reminders: await listReminders(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/reminders/scan',
    tag: 'Reminders',
    access: 'member',
    tenantData: true,
    summary: 'Scan the firm for due kit, vans and low or expiring stock now and send what is new (Owner, Admin)',
    request: {},
    responses: {
      200: {
        description: 'How many reminders were new and sent (0 when everything due was already reminded)',
        schema: reminderScanResponseSchema,
      },
    },
    handle: async ({ res, deps, actor }) => {
      res.json({ sent: await scanRemindersNow(deps, actor) });
    },
  }),
  defineRoute({
    method: 'get',
    path: '/reminder-settings',
    tag: 'Reminders',
    access: 'member',
    tenantData: true,
    summary: 'When the daily scan runs and which reminders are on (Owner, Admin)',
    request: {},
    responses: { 200: { description: 'Settings', schema: reminderSettingsResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ settings: await getReminderSettings(deps, actor) });
    },
  }),
  defineRoute({
    method: 'put',
    path: '/reminder-settings',
    tag: 'Reminders',
    access: 'member',
    tenantData: true,
    summary:
      'Change the scan hour or turn a kind of reminder on or off; a switch left out keeps its value (Owner, Admin)',
    request: { body: reminderSettingsSchema },
    responses: { 200: { description: 'Saved', schema: reminderSettingsResponseSchema } },
    handle: async ({ body, res, deps, actor }) => {
      res.json({ settings: await updateReminderSettings(deps, actor, body) });
    },
  }),
];
