// Web: the drawings are their own chunk, fetched after the card has mounted, so the chart
// code never weighs on the first route's JavaScript.
import type * as Drawings from './chart-drawings';

export function loadDrawings(): Promise<typeof Drawings> {
  return import('./chart-drawings');
}
