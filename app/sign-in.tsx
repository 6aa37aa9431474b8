import { useLocalSearchParams } from '@/lib/router';
import Head from 'expo-router/head';
import { ScrollView, StyleSheet } from 'react-native';

import { SignInPanel } from '@/components/auth/sign-in-panel';
import { colors, space } from '@/components/theme';
import { useAuthOptionsQuery, useMeQuery } from '@/hooks/use-auth';
import { openServerPage } from '@/lib/open-server-page';

/** Where invitations and failed sign-ins land; hands over to the server's sign-in flow. */
export default function SignInScreen() {
  const { error } = useLocalSearchParams<{ error?: string }>();
  const options = useAuthOptionsQuery();
  const me = useMeQuery();
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content}>
      <Head>
        <title>Sign in · Crestwatch</title>
      </Head>
      <SignInPanel
        options={options}
        me={me}
        errorCode={typeof error === 'string' ? error : undefined}
        onContinue={openServerPage}
      />
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.background },
  content: { padding: space.lg },
});
