import { onDemandPage } from '@/components/layout/on-demand-page';
import { staffPages } from '@/components/staff-pages/source';

/** Upload indicator series and see past uploads. The screen is in components/staff-pages/ (on the web, a chunk loaded on demand). */
export default onDemandPage(staffPages, 'UploadsPage', 'Uploads');
