import { onDemandPage } from '@/components/layout/on-demand-page';
import { staffPages } from '@/components/staff-pages/source';

/** Admin: the audit log, filtered. The screen is in components/staff-pages/ (on the web, a chunk loaded on demand). */
export default onDemandPage(staffPages, 'AuditPage', 'Audit log');
