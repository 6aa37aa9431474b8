/** Alerts and subscriptions: GET /api/alerts, /api/districts/:code/alerts, /api/subscriptions. */
import * as z from './kit';
import { isoTime } from './common';

export const ALERT_KINDS = ['crossing', 'threshold_shift', 'shape_change', 'significance_change'] as const;
export const AlertKindSchema = z.enum(ALERT_KINDS);
export type AlertKind = z.infer<typeof AlertKindSchema>;

export const DistrictAlertSchema = z.object({
  id: z.number(),
  runId: z.number(),
  /** the track whose runs were compared (never two tracks) */
  track: z.string(),
  trackName: z.string(),
  kind: AlertKindSchema,
  details: z.record(z.string(), z.unknown()),
  createdAt: isoTime,
});
export type DistrictAlert = z.infer<typeof DistrictAlertSchema>;
export const DistrictAlertsResponseSchema = z.object({ alerts: z.array(DistrictAlertSchema) });
export type DistrictAlertsResponse = z.infer<typeof DistrictAlertsResponseSchema>;

export const FeedAlertSchema = z.extend(DistrictAlertSchema, {
  districtCode: z.string(),
  districtName: z.string(),
  read: z.boolean(),
});
export type FeedAlert = z.infer<typeof FeedAlertSchema>;
export const AlertFeedResponseSchema = z.object({ alerts: z.array(FeedAlertSchema), unread: z.number() });
export type AlertFeedResponse = z.infer<typeof AlertFeedResponseSchema>;

const subscriptionFields = {
  scope: z.enum(['district', 'districts', 'region']),
  districtCodes: z.array(z.string()),
  kinds: z.array(AlertKindSchema),
  delivery: z.enum(['instant', 'digest']),
  attachBrief: z.boolean(),
  /** 'all' (every track, including tracks created later) or the chosen track codes */
  tracks: z.union([z.literal('all'), z.array(z.string())]),
};
/** The body of POST /api/subscriptions as the app sends it. */
export const SubscriptionInputSchema = z.object(subscriptionFields);
export type SubscriptionInput = z.infer<typeof SubscriptionInputSchema>;

export const SubscriptionSchema = z.object({ id: z.number(), ...subscriptionFields, createdAt: isoTime });
export type Subscription = z.infer<typeof SubscriptionSchema>;
export const SubscriptionsResponseSchema = z.object({ subscriptions: z.array(SubscriptionSchema) });
export type SubscriptionsResponse = z.infer<typeof SubscriptionsResponseSchema>;
export const SubscriptionAnswerSchema = z.object({ subscription: SubscriptionSchema });
