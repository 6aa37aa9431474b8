import { StyleSheet, Text, View } from 'react-native';

import { radius, space, toneColors, type } from '@/components/theme';
import { textSize } from '@/lib/text-size';
import { ApiError } from '@/lib/api-client';
import { SESSION_END_CHANGE_WORDS, sessionEndReason } from '@/lib/session-end';

/** Words for a failed change: the server's own message for refusals (403, 409, 422). */
export function describeSendError(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.code === 'offline') return error.message;
    if (error.status === 0) return 'The Crestwatch server could not be reached. Nothing was changed; try again.';
    const ended = sessionEndReason(error);
    if (ended) return SESSION_END_CHANGE_WORDS[ended];
    if (error.status === 401) return 'Your session has ended. Sign in again, then repeat the change.';
    if (error.status === 403 && error.code !== 'csrf_failed') return `Not allowed for your role: ${error.message}`;
    if (error.isClientError) return error.message;
    return `The server could not make the change (${error.status} ${error.code}). Try again in a moment.`;
  }
  return error instanceof Error ? error.message : 'Something unexpected went wrong.';
}

export type MutationNoticeProps = {
  /** The mutation's error, when it failed. */
  error?: unknown;
  /** What to say when it worked (omit to say nothing). */
  success?: string | null;
  testID?: string;
};

/** One line under a form or button saying how the last change went. */
export function MutationNotice({ error, success, testID }: MutationNoticeProps) {
  if (error) {
    const c = toneColors.danger;
    return (
      <View
        style={[styles.box, { backgroundColor: c.fill }]}
        accessibilityRole="alert"
        testID={testID ? `${testID}-error` : undefined}
      >
        <Text style={[styles.text, { color: c.ink }]}>{describeSendError(error)}</Text>
      </View>
    );
  }
  if (success) {
    const c = toneColors.success;
    return (
      <View
        style={[styles.box, { backgroundColor: c.fill }]}
        accessibilityLiveRegion="polite"
        testID={testID ? `${testID}-ok` : undefined}
      >
        <Text style={[styles.text, { color: c.ink }]}>{success}</Text>
      </View>
    );
  }
  return null;
}

const styles = StyleSheet.create({
  box: { borderRadius: radius.md, paddingHorizontal: space.md, paddingVertical: space.sm },
  text: { ...type.body, fontFamily: type.label.fontFamily, fontSize: textSize(14) },
});

/**
 * Per-field messages from a 400 `validation_failed` answer (details.issues with paths like
 * "body.name"), keyed by the field's name under the body.
 */
export function fieldErrorsOf(error: unknown): Record<string, string> {
  const out: Record<string, string> = {};
  if (!(error instanceof ApiError) || error.status !== 400) return out;
  const issues = (error.details as { issues?: { path?: unknown; message?: unknown }[] } | undefined)?.issues;
  if (!Array.isArray(issues)) return out;
  for (const i of issues) {
    if (typeof i.path !== 'string' || typeof i.message !== 'string' || !i.path.startsWith('body.')) continue;
    const field = i.path.slice('body.'.length).split('.')[0];
    if (field && !(field in out)) out[field] = i.message;
  }
  return out;
}
