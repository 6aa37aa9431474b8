import { foldForSearch, searchDistricts } from '@/lib/district-search';

const districts = [
  { code: 'D01', name: 'Aldercombe' },
  { code: 'D12', name: 'Łąkowice Upper' },
  { code: 'D13', name: 'Sønderhøj' },
  { code: 'D14', name: 'Upper Ashby' },
];

describe('district search', () => {
  it('folds case, accents and stroke letters', () => {
    expect(foldForSearch('  Łąkowice ')).toBe('lakowice');
    expect(foldForSearch('Sønderhøj')).toBe('sonderhoj');
    expect(foldForSearch('Straße')).toBe('strasse');
  });

  it('matches name or code; every word must match, in any order', () => {
    expect(searchDistricts(districts, 'lakow').map((d) => d.code)).toEqual(['D12']);
    expect(searchDistricts(districts, 'd01').map((d) => d.code)).toEqual(['D01']);
    expect(searchDistricts(districts, 'upper').map((d) => d.code)).toEqual(['D12', 'D14']);
    expect(searchDistricts(districts, 'ashby upper').map((d) => d.code)).toEqual(['D14']);
    expect(searchDistricts(districts, 'soender')).toEqual([]);
  });

  it('keeps every district, in order, for an empty query', () => {
    expect(searchDistricts(districts, '   ')).toEqual(districts);
  });
});
