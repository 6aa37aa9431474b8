import type { ReactNode } from 'react';

import type { BriefPaperSize } from '@/contracts/briefs';

export type BriefFrameProps = {
  /** The server path of the same brief as PDF. */
  pdfPath: string;
  /** "District brief of Amberlyn Reach", for the PDF link's accessible name. */
  what: string;
  paperSize: BriefPaperSize;
  /** A link back (to the district card or the region), shown above the brief. */
  back?: ReactNode;
  children: ReactNode;
};
