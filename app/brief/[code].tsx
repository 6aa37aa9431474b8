import { onDemandPage } from '@/components/layout/on-demand-page';
import { printPages } from '@/components/print-pages/source';

/** A district's brief as a print-friendly page (the same content as its PDF). The screen is in components/print-pages/ (on the web, a chunk loaded on demand). */
export default onDemandPage(printPages, 'DistrictBriefPage', 'District brief');
