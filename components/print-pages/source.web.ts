// Web: the print views are a chunk of their own, fetched when a brief is opened, so their
// code never weighs on the region or the card.
import type { PageSource } from '@/components/layout/on-demand-page';

import type * as Pages from './pages';

export const printPages: PageSource<typeof Pages> = { load: () => import('./pages') };
