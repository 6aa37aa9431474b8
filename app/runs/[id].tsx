import { onDemandPage } from '@/components/layout/on-demand-page';
import { staffPages } from '@/components/staff-pages/source';

/** One run: its progress, then its review. The screen is in components/staff-pages/ (on the web, a chunk loaded on demand). */
export default onDemandPage(staffPages, 'RunPage', 'Run review');
