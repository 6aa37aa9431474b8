/** Which arrangement of the region list and the district detail the window gets. */
export type LayoutMode = 'phone' | 'wide';
