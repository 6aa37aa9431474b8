// Native (and the component tests): the staff screens come with the app bundle; the web
// file loads them on demand. One contract: components/layout/on-demand-page.tsx.
import type { PageSource } from '@/components/layout/on-demand-page';

import * as pages from './pages';

export const staffPages: PageSource<typeof pages> = { ready: pages };
