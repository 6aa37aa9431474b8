import Head from 'expo-router/head';
import { StyleSheet, View } from 'react-native';

import { AlertsFeedColumn } from '@/components/alerts/alerts-feed-column';
import { layout, space } from '@/components/theme';
import { TextLink } from '@/components/ui/text-link';
import { useAlertFeedQuery, useMarkAlertReadMutation } from '@/hooks/use-alerts';
import { useLayoutMode } from '@/hooks/use-layout-mode';

/** The caller's alerts as a page (phones and windows too narrow for the third column). */
export default function AlertsScreen() {
  const mode = useLayoutMode();
  const feed = useAlertFeedQuery();
  const markRead = useMarkAlertReadMutation();
  return (
    <View style={styles.wrap}>
      <Head>
        <title>Your alerts · Crestwatch</title>
      </Head>
      {mode === 'phone' ? (
        <View style={styles.back}>
          <TextLink href="/" label="All districts" leading="← " />
        </View>
      ) : null}
      <AlertsFeedColumn feed={feed} onRead={markRead.mutate} />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { flex: 1, maxWidth: layout.detailMaxWidth },
  back: { paddingHorizontal: space.lg, paddingTop: space.sm },
});
