/** The admin settings every number of the engine, alerts, uploads and briefs comes from. */
import { z } from 'zod';

/**
 * A well-formed BCP 47 tag (Intl.getCanonicalLocales throws on anything else) in its
 * canonical spelling, that the platform's ICU formats numbers and dates for: with no
 * locale data, Intl would fall back to another locale without saying so.
 */
export function isSupportedLocale(tag: string): boolean {
  try {
    const [canonical] = Intl.getCanonicalLocales(tag);
    if (canonical !== tag) return false;
    return (
      Intl.NumberFormat.supportedLocalesOf([tag], { localeMatcher: 'lookup' }).length === 1 &&
      Intl.DateTimeFormat.supportedLocalesOf([tag], { localeMatcher: 'lookup' }).length === 1
    );
  } catch {
    return false;
  }
}

export const SettingsSchema = z.object({
  confidenceLevel: z.number().min(0.5).max(0.999).describe('Confidence level of intervals (default 95%)'),
  alpha: z.number().min(0.001).max(0.5).describe('Test level α of the U-test, Wald test and shapes (default 0.05)'),
  thresholdShiftPercent: z
    .number()
    .min(0.1)
    .max(1000)
    .describe('A threshold_shift alert fires when X* moves more than this percent'),
  uploadChangeFactor: z
    .number()
    .min(1.01)
    .max(1000)
    .describe('An upload warns when a value changes by more than this factor'),
  regionTimeZone: z
    .string()
    .refine((tz) => {
      try {
        new Intl.DateTimeFormat('en', { timeZone: tz });
        return true;
      } catch {
        return false;
      }
    }, 'an IANA time zone such as Europe/Lisbon or UTC')
    .describe('Time zone of the schedule and of dates on briefs'),
  regionLocale: z
    .string()
    .refine(isSupportedLocale, 'a BCP 47 language tag the server can format for, such as en-GB, de-DE or fr-FR')
    .describe('Language and region whose number and date formats screens and briefs use (BCP 47, default en-GB)'),
  briefPaperSize: z.enum(['A4', 'LETTER']).describe('Paper size of briefs'),
  scheduleCron: z
    .string()
    .regex(/^\S+\s+\S+\s+\S+\s+\S+\s+\S+$/, 'five cron fields: minute hour day-of-month month day-of-week')
    .describe('When quarterly re-estimation runs start (cron, in the region time zone)'),
  scheduleEnabled: z.boolean().describe('Whether scheduled runs start at all'),
  sentMailRetentionDays: z
    .number()
    .int()
    .min(1)
    .max(3650)
    .describe(
      'Days a sent (or finally failed) e-mail is kept in the outbox before the nightly retention job deletes it',
    ),
  unreadAlertRetentionDays: z
    .number()
    .int()
    .min(7)
    .max(3650)
    .describe('Days an alert nobody has read stays in feeds before the nightly retention job deletes it'),
  invitationDays: z
    .number()
    .int()
    .min(1)
    .max(365)
    .describe('Days an invitation may be used before it lapses (re-sending renews it)'),
  reviewWaitDays: z
    .number()
    .int()
    .min(1)
    .max(365)
    .describe('Days a scheduled run may wait in review before staff are told (in the app and by e-mail)'),
});
export type Settings = z.infer<typeof SettingsSchema>;

/** Defaults from the product's conventions (docs/method.md): 95%, α = 0.05, 10%, quarterly at 06:00. */
export const DEFAULT_SETTINGS: Settings = {
  confidenceLevel: 0.95,
  alpha: 0.05,
  thresholdShiftPercent: 10,
  uploadChangeFactor: 3,
  regionTimeZone: 'UTC',
  // Today's formats: British English ("1,234.5", "4 December 2026").
  regionLocale: 'en-GB',
  briefPaperSize: 'A4',
  scheduleCron: '0 6 1 1,4,7,10 *',
  scheduleEnabled: true,
  // Retention: a quarter of sent mail is enough to answer "did I get it?"; a year of
  // unread alerts spans four quarterly runs (common practice, no standard).
  sentMailRetentionDays: 90,
  unreadAlertRetentionDays: 365,
  invitationDays: 14,
  // A week: a quarterly run left longer in review keeps officials on last quarter's figures (issue 14).
  reviewWaitDays: 7,
};
