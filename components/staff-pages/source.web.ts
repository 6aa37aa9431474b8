// Web: the staff screens are one chunk of their own, fetched when a staff route first
// renders. Metro puts code that two route chunks share into the common chunk every page
// loads; behind one dynamic import the staff screens share nothing with the public routes.
import type { PageSource } from '@/components/layout/on-demand-page';

import type * as Pages from './pages';

export const staffPages: PageSource<typeof Pages> = { load: () => import('./pages') };
