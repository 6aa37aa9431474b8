import type { DistrictSummary } from './api-types';

/** Lower case without accents, so "ostrava" finds "Óstrava" and "d07" finds "D07". */
export function foldForSearch(text: string): string {
  return text
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLocaleLowerCase('en')
    .trim();
}

/**
 * Districts whose name or code contains the query (accent- and case-insensitive). Several
 * words must all match, in any order. An empty query keeps every district, in the given order.
 */
export function searchDistricts<T extends Pick<DistrictSummary, 'code' | 'name'>>(
  districts: readonly T[],
  query: string,
): T[] {
  const words = foldForSearch(query).split(/\s+/).filter(Boolean);
  if (words.length === 0) return [...districts];
  return districts.filter((d) => {
    const haystack = `${foldForSearch(d.name)} ${foldForSearch(d.code)}`;
    return words.every((w) => haystack.includes(w));
  });
}
