import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';

import { MutationNotice } from '@/components/form/mutation-notice';
import { colors, radius, space, type } from '@/components/theme';
import { ConfirmAction } from '@/components/ui/confirm-action';
import type { PublishAnswer, RunState } from '@/contracts/runs';

export type DecisionBarProps = {
  runId: number;
  state: RunState;
  onPublish: () => Promise<PublishAnswer>;
  onDiscard: () => Promise<unknown>;
};

/** Publish (officials see it, alerts go out) or discard a run in review. */
export function DecisionBar({ runId, state, onPublish, onDiscard }: DecisionBarProps) {
  const [busy, setBusy] = useState<'publish' | 'discard' | null>(null);
  const [outcome, setOutcome] = useState<{ error?: unknown; success?: string } | null>(null);
  const act = async (which: 'publish' | 'discard') => {
    setBusy(which);
    setOutcome(null);
    try {
      if (which === 'publish') {
        const a = await onPublish();
        setOutcome({
          success:
            a.previousRunId === null
              ? `Published. Nothing was published before, so no alerts were raised.`
              : `Published. Compared with run #${a.previousRunId}: ${a.alerts} ${a.alerts === 1 ? 'alert' : 'alerts'} raised, ${a.mails} ${a.mails === 1 ? 'e-mail' : 'e-mails'} queued.`,
        });
      } else {
        await onDiscard();
        setOutcome({ success: 'Discarded. Nothing changed for officials.' });
      }
    } catch (error) {
      setOutcome({ error });
    } finally {
      setBusy(null);
    }
  };
  const canPublish = state === 'in_review';
  const canDiscard = state === 'in_review' || state === 'queued' || state === 'failed';
  if (!canPublish && !canDiscard && !outcome) return null;
  return (
    <View style={styles.bar} testID="decision">
      {canPublish ? (
        <Text style={styles.lead}>
          Read the changes below. Publishing makes run #{runId} what officials see and sends the alerts its changes
          raise.
        </Text>
      ) : null}
      <View style={styles.buttons}>
        {canPublish ? (
          <ConfirmAction
            label="Publish this run"
            question={`Publish run #${runId}? Officials will see it and subscribers get its alerts.`}
            confirmLabel="Publish"
            variant="solid"
            busy={busy === 'publish'}
            busyLabel="Publishing…"
            disabled={busy === 'discard'}
            onConfirm={() => void act('publish')}
            testID="run-publish"
          />
        ) : null}
        {canDiscard ? (
          <ConfirmAction
            label="Discard"
            question={`Discard run #${runId}? Nothing changes for officials.`}
            confirmLabel="Discard"
            variant="danger"
            busy={busy === 'discard'}
            busyLabel="Discarding…"
            disabled={busy === 'publish'}
            onConfirm={() => void act('discard')}
            testID="run-discard"
          />
        ) : null}
      </View>
      {outcome ? <MutationNotice error={outcome.error} success={outcome.success} testID="run-decision" /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    gap: space.md,
    backgroundColor: colors.selected,
    borderLeftWidth: 4,
    borderLeftColor: colors.selectedRule,
    borderRadius: radius.lg,
    padding: space.lg,
  },
  lead: { ...type.body, color: colors.text },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, alignItems: 'flex-start' },
});
