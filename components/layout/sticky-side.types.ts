import type { ReactNode } from 'react';

/** The side panel beside a long table in the wide layout. */
export type StickySideProps = { children: ReactNode; testID?: string };

/** Room left above and below the panel while it sticks: the header bar, the tabs and a margin. */
export const STICKY_SIDE_CLEARANCE = 120;
