/**
 * The kinds of alert a publish can raise. A leaf module: alerts raise them, subscriptions
 * choose among them, e-mails name them, and none of those features imports another for it.
 */
export const ALERT_KINDS = ['crossing', 'threshold_shift', 'shape_change', 'significance_change'] as const;
export type AlertKind = (typeof ALERT_KINDS)[number];
