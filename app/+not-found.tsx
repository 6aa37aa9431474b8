import Head from 'expo-router/head';
import { StyleSheet, View } from 'react-native';

import { StatePanel } from '@/components/state/state-panel';
import { space } from '@/components/theme';
import { TextLink } from '@/components/ui/text-link';

export default function NotFoundScreen() {
  return (
    <View style={styles.wrap} testID="not-found">
      <Head>
        <title>Page not found · Crestwatch</title>
      </Head>
      <StatePanel title="There is no page at this address" message="The link may be old, or the address mistyped.">
        <TextLink href="/" label="Go to the region list" />
      </StatePanel>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { padding: space.lg, maxWidth: 640 },
});
