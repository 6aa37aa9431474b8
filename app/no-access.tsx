import { useLocalSearchParams } from '@/lib/router';
import Head from 'expo-router/head';
import { ScrollView, StyleSheet } from 'react-native';

import { NoAccessPanel } from '@/components/auth/no-access-panel';
import { colors, space } from '@/components/theme';

/** Where the server sends a sign-in it refused (not invited, deactivated). */
export default function NoAccessScreen() {
  const { reason } = useLocalSearchParams<{ reason?: string }>();
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content}>
      <Head>
        <title>No access · Crestwatch</title>
      </Head>
      <NoAccessPanel reason={typeof reason === 'string' ? reason : undefined} />
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.background },
  content: { padding: space.lg, maxWidth: 640 },
});
