import parser from 'cron-parser';
import type { AppContext } from '../context';
import { ValidationError } from '../http/errors';
import { ADMIN, callerOf, route, STAFF, type RouteSpec } from '../http/routes';
import { SettingsSchema, type Settings } from './schema';
import * as service from './service';
import { SettingsResponseSchema } from '../../contracts/settings';

/** The scheduled job as pg-boss will start it: its cron, time zone and next start. */
export function scheduleView(s: Settings, now = new Date()) {
  let next: string | null = null;
  try {
    next = parser
      .parseExpression(s.scheduleCron, { tz: s.regionTimeZone, currentDate: now })
      .next()
      .toDate()
      .toISOString();
  } catch {
    next = null;
  }
  return {
    cron: s.scheduleCron,
    timeZone: s.regionTimeZone,
    enabled: s.scheduleEnabled,
    nextRunAt: s.scheduleEnabled ? next : null,
  };
}

export function settingsRoutes(ctx: AppContext): RouteSpec[] {
  const { db } = ctx;
  return [
    route({
      method: 'get',
      path: '/api/settings',
      answer: SettingsResponseSchema,
      allow: STAFF,
      tag: 'settings',
      summary: 'The settings the engine, alerts, uploads and briefs use, and the schedule with its next start',
      handler: async () => {
        const settings = await service.getSettings(db);
        return { settings, schedule: scheduleView(settings) };
      },
    }),
    route({
      method: 'patch',
      path: '/api/settings',
      answer: SettingsResponseSchema,
      allow: ADMIN,
      tag: 'settings',
      summary: 'Change settings (audited); a schedule change re-registers the cron job',
      schemas: {
        body: SettingsSchema.partial().refine((b) => Object.keys(b).length > 0, 'give at least one setting'),
      },
      handler: async ({ body }, req) => {
        if (body.scheduleCron) {
          try {
            parser.parseExpression(body.scheduleCron);
          } catch (err) {
            throw new ValidationError(`scheduleCron is not a valid cron expression: ${(err as Error).message}`, {
              field: 'scheduleCron',
            });
          }
        }
        const settings = await service.updateSettings(db, callerOf(req)!, body);
        if (ctx.jobs && (body.scheduleCron || body.regionTimeZone || body.scheduleEnabled !== undefined)) {
          await ctx.jobs.schedule(settings.scheduleCron, settings.regionTimeZone, settings.scheduleEnabled);
        }
        return { settings, schedule: scheduleView(settings) };
      },
    }),
  ];
}
