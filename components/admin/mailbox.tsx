import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';

import { TextField } from '@/components/form/text-field';
import { Page } from '@/components/layout/page';
import { QueryErrorPanel } from '@/components/state/query-error-panel';
import type { QueryState } from '@/components/state/query-state';
import { Skeleton } from '@/components/state/skeleton';
import { StatePanel } from '@/components/state/state-panel';
import { colors, radius, space, type } from '@/components/theme';
import { textSize } from '@/lib/text-size';
import { focusOutline, type InteractionState } from '@/components/ui/interaction';
import { ApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format-time';
import type { CaughtMail } from '@/contracts/people';

export type MailboxScreenProps = {
  to: string;
  onTo: (to: string) => void;
  messages: QueryState<CaughtMail[]>;
};

/** Demo mode: the mail the local catcher received (invitations, alerts, digests), newest first. */
export function MailboxScreen({ to, onTo, messages }: MailboxScreenProps) {
  const [draft, setDraft] = useState(to);
  return (
    <Page
      title="Mailbox (demo)"
      intro="In demo mode nothing leaves this machine: mail Crestwatch sends lands in a local catcher and shows here."
      testID="mailbox-screen"
    >
      <View style={styles.filter}>
        <TextField
          label="To (exact address)"
          value={draft}
          onChangeText={setDraft}
          onSubmitEditing={() => onTo(draft)}
          keyboardType="email-address"
          placeholder="Every recipient"
          hint="Press Enter to filter; clear it to see all."
          testID="mailbox-to"
        />
      </View>
      <MailList messages={messages} />
    </Page>
  );
}

function MailList({ messages }: { messages: QueryState<CaughtMail[]> }) {
  if (messages.status === 'pending') return <Skeleton width="100%" height={200} />;
  if (messages.status === 'error' || !messages.data) {
    if (messages.error instanceof ApiError && messages.error.code === 'not_found') {
      return <StatePanel testID="mailbox-off" title="No mailbox on this server" message={messages.error.message} />;
    }
    return (
      <QueryErrorPanel
        what="the mailbox"
        error={messages.error}
        retrying={messages.isFetching}
        onRetry={() => void messages.refetch()}
        testID="mailbox-error"
      />
    );
  }
  if (messages.data.length === 0) {
    return (
      <StatePanel
        testID="mailbox-empty"
        title="No mail yet"
        message="Invite someone, or publish a run with subscribers, and the messages appear here."
      />
    );
  }
  return (
    <View style={styles.list} testID="mailbox-list">
      {messages.data.map((m) => (
        <MailItem key={m.id} mail={m} />
      ))}
    </View>
  );
}

function MailItem({ mail }: { mail: CaughtMail }) {
  const [open, setOpen] = useState(false);
  return (
    <View style={styles.item} testID={`mail-${mail.id}`}>
      <Pressable
        accessibilityRole="button"
        aria-expanded={open}
        accessibilityLabel={`${mail.subject}, to ${mail.to.join(', ')}. ${open ? 'Hide' : 'Read'} the message.`}
        onPress={() => setOpen((o) => !o)}
        style={(s: InteractionState) => [styles.head, s.hovered && styles.hover, focusOutline(s, 'inside')]}
      >
        <View style={styles.words}>
          <Text style={styles.subject}>{mail.subject || '(no subject)'}</Text>
          <Text style={styles.meta}>
            To {mail.to.join(', ')} · {formatDateTime(mail.receivedAt)}
            {mail.attachments?.length
              ? ` · ${mail.attachments.length} attachment${mail.attachments.length === 1 ? '' : 's'}`
              : ''}
          </Text>
        </View>
        <Text style={styles.toggle}>{open ? 'Hide' : 'Read'}</Text>
      </Pressable>
      {open ? (
        <View style={styles.body}>
          <Text style={styles.meta}>From {mail.from ?? 'unknown'}</Text>
          <Text style={styles.text} testID={`mail-${mail.id}-text`}>
            {mail.text}
          </Text>
          {mail.attachments?.map((a, i) => (
            <Text key={i} style={styles.meta}>
              Attached: {a.filename ?? 'unnamed'} ({a.contentType}, {a.size} bytes)
            </Text>
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  filter: { maxWidth: 420 },
  list: { gap: space.xs },
  item: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.md,
    overflow: 'hidden',
  },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.md, padding: space.md, minHeight: 56 },
  hover: { backgroundColor: colors.selected },
  words: { flex: 1, gap: space.xxs },
  subject: { ...type.bodyStrong, fontSize: textSize(14), color: colors.text },
  meta: { ...type.caption, color: colors.textMuted },
  toggle: { ...type.label, color: colors.link, textDecorationLine: 'underline' },
  body: { paddingHorizontal: space.md, paddingBottom: space.md, gap: space.sm },
  text: { ...type.body, color: colors.text },
});
