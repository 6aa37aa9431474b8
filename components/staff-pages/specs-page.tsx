import { useLocalSearchParams } from '@/lib/router';
import Head from 'expo-router/head';

import { SpecsRouteBody } from './spec-page';

/** The saved model specs, none open. */
export function SpecsPage() {
  const { archived } = useLocalSearchParams<{ archived?: string }>();
  const notice =
    typeof archived === 'string' && archived ? `Archived “${archived}”. Runs keep their own copy of it.` : null;
  return (
    <>
      <Head>
        <title>Model specs · Crestwatch</title>
      </Head>
      <SpecsRouteBody selected={null} notice={notice} />
    </>
  );
}
