// Plain words (issue 17): officials read what `flat` means, analysts keep the term. The
// subject–verb agreement rule follows English grammar (a plural head noun takes "rise").
import { shapeWord } from '@/components/runs/run-words';
import { alertDetail } from '@/lib/alert-text';
import { SHAPE_LABEL, shapeWords } from '@/lib/estimate-words';
import { agree, isPluralName, shapeForOfficials } from '@/lib/plain-words';

describe('plain words for a flat curve', () => {
  it('analyst screens keep the term', () => {
    expect(shapeWord('flat')).toBe('Flat');
    expect(SHAPE_LABEL.flat).toBe('Flat');
  });

  it('officials read what it means, at the level from α', () => {
    expect(shapeWords('flat', 0.05)).toBe('No clear link with income at the 5% level');
    expect(shapeWords('flat', 0.01)).toBe('No clear link with income at the 1% level');
    expect(shapeWords('inverted_u', 0.05)).toBe('Rise then fall');
    expect(shapeForOfficials('flat', '5 %')).toBe('No clear link with income at the 5 % level');
  });

  it('alerts as officials read them', () => {
    expect(alertDetail('shape_change', { from: 'inverted_u', to: 'flat' })).toBe(
      'Shape changed from Rise then fall to No clear link with income.',
    );
  });
});

describe('the indicator as a subject', () => {
  it.each([
    ['CO2 emissions per person', true],
    ['SO2 emissions per person', true],
    ['PM2.5 annual mean concentration', false],
    ['PM2.5 annual mean', false],
    ['emissions', true],
    ['Nitrogen dioxide (NO2) concentration', false],
  ])('%s is plural: %s', (name, plural) => {
    expect(isPluralName(name)).toBe(plural);
    expect(agree(name, 'rises', 'rise')).toBe(plural ? 'rise' : 'rises');
  });
});
