import type { DistrictSummary } from '@/contracts/districts';

/** Letters that carry no combining mark, so NFD leaves them alone: fold them by hand. */
const LETTER_FOLDS: Record<string, string> = {
  ł: 'l',
  ø: 'o',
  đ: 'd',
  ħ: 'h',
  ı: 'i',
  ŧ: 't',
  ß: 'ss',
  æ: 'ae',
  œ: 'oe',
  þ: 'th',
  ð: 'd',
};

/** Lower case without accents, so "lakow" finds "Łąkowice" and "d07" finds "D07". */
export function foldForSearch(text: string): string {
  return text
    .toLocaleLowerCase('en')
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[łøđħıŧßæœþð]/g, (ch) => LETTER_FOLDS[ch] ?? ch)
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
