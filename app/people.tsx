import { onDemandPage } from '@/components/layout/on-demand-page';
import { staffPages } from '@/components/staff-pages/source';

/** Admin: people, roles, invitations. The screen is in components/staff-pages/ (on the web, a chunk loaded on demand). */
export default onDemandPage(staffPages, 'PeoplePage', 'People');
