/**
 * The words of alert e-mails (our own), with the card link (carrying the track) and the
 * unsubscribe link. The subject names the track; a digest groups its alerts by track.
 */
import { SHAPE_PLAIN_SHORT, type ShapeKey } from '../../lib/plain-words';
import type { AlertKind } from '../common/alert-kinds';

export const KIND_LABEL: Record<AlertKind, string> = {
  crossing: 'moved across its threshold band',
  threshold_shift: 'has a threshold that moved',
  shape_change: 'has a curve of a different shape',
  significance_change: 'has a changed U-test verdict',
};

const STANDING_WORDS: Record<string, string> = {
  approaching: 'below the threshold band',
  at_turn: 'inside the threshold band',
  past_turn: 'beyond the threshold band',
};

/** Shapes in plain words for the e-mail (the same words as the card and its alerts: lib/plain-words.ts). */
const shapeWords = (v: unknown): string =>
  String(v) in SHAPE_PLAIN_SHORT
    ? SHAPE_PLAIN_SHORT[String(v) as ShapeKey].toLowerCase()
    : String(v).replace(/_/g, ' ');

export interface AlertForMail {
  id: number;
  kind: AlertKind;
  details: Record<string, unknown>;
  districtCode: string;
  districtName: string;
  runId: number;
  /** the track whose runs were compared */
  track: { code: string; name: string };
}

const q = (track: { code: string }) => `?track=${encodeURIComponent(track.code)}`;

export function alertSentence(a: AlertForMail): string {
  const d = a.details;
  switch (a.kind) {
    case 'crossing':
      return `${a.districtName} (${a.districtCode}) is now ${STANDING_WORDS[String(d.to)] ?? d.to} (was ${STANDING_WORDS[String(d.from)] ?? d.from}).`;
    case 'threshold_shift':
      return `${a.districtName} (${a.districtCode}): the estimated threshold moved ${Number(d.percent) > 0 ? 'up' : 'down'} by ${Math.abs(Number(d.percent)).toFixed(0)}%.`;
    case 'shape_change':
      return `${a.districtName} (${a.districtCode}): the curve now reads ${shapeWords(d.to)} (was ${shapeWords(d.from)}).`;
    case 'significance_change':
      return `${a.districtName} (${a.districtCode}): the U-test ${d.to ? 'now supports' : 'no longer supports'} a turn at the chosen test level.`;
  }
}

const CAUTION =
  'These are statistical associations in past data, not forecasts; thresholds move when data are revised. They do not replace statutory standards or the judgement of qualified staff.';

export function instantMail(a: AlertForMail, publicUrl: string, unsubscribeUrl: string) {
  return {
    subject: `Crestwatch, ${a.track.name}: ${a.districtName} ${KIND_LABEL[a.kind]}`,
    text: [
      `Track: ${a.track.name}.`,
      alertSentence(a),
      '',
      `District card: ${publicUrl}/district/${encodeURIComponent(a.districtCode)}${q(a.track)}`,
      `Published run #${a.runId}.`,
      '',
      CAUTION,
      '',
      `Stop these e-mails: ${unsubscribeUrl}`,
    ].join('\n'),
  };
}

export function digestMail(
  alerts: AlertForMail[],
  runId: number,
  publicUrl: string,
  unsubscribeUrl: string,
  withBrief: boolean,
) {
  const tracks = [...new Map(alerts.map((a) => [a.track.code, a.track])).values()];
  const names = tracks.map((t) => t.name).join(', ');
  return {
    subject: `Crestwatch, ${names}: ${alerts.length} change${alerts.length === 1 ? '' : 's'} in published run #${runId}`,
    text: [
      `Run #${runId} was published. For the districts you follow:`,
      ...tracks.flatMap((t) => [
        '',
        `${t.name} (${publicUrl}/${q(t)}):`,
        ...alerts
          .filter((a) => a.track.code === t.code)
          .map((a) => `• ${alertSentence(a)} ${publicUrl}/district/${encodeURIComponent(a.districtCode)}${q(t)}`),
      ]),
      '',
      withBrief ? 'The region brief is attached.' : '',
      '',
      CAUTION,
      '',
      `Stop these e-mails: ${unsubscribeUrl}`,
    ]
      .filter((l, i, all) => !(l === '' && all[i - 1] === ''))
      .join('\n'),
  };
}
