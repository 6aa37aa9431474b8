import { onDemandPage } from '@/components/layout/on-demand-page';
import { staffPages } from '@/components/staff-pages/source';

/** One saved spec in the editor (`new` for a fresh one). The screen is in components/staff-pages/ (on the web, a chunk loaded on demand). */
export default onDemandPage(staffPages, 'SpecPage', 'Model spec');
