import Head from 'expo-router/head';

import { MethodView } from '@/components/method/method-view';
import { useLayoutMode } from '@/hooks/use-layout-mode';

/** How Crestwatch estimates: formulas, references, cautions, the demo region. */
export default function MethodScreen() {
  const mode = useLayoutMode();
  return (
    <>
      <Head>
        <title>Method · Crestwatch</title>
      </Head>
      <MethodView showBackLink={mode === 'phone'} />
    </>
  );
}
