// Native: the drawings load with the app bundle (no web chunk to split off); the promise
// keeps one contract with the web file, where they are a chunk of their own.
import type * as Drawings from './chart-drawings';

export function loadDrawings(): Promise<typeof Drawings> {
  return Promise.resolve(require('./chart-drawings') as typeof Drawings);
}
