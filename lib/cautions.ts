// The cautions Crestwatch shows with every figure (docs/method.md, "Cautions"):
// a short form for the district card and the region view, the full form for the method page.

export type Caution = { key: string; short: string; full: string };

export const CAUTIONS: Caution[] = [
  {
    key: 'association',
    short: 'An association in past data, not a causal law or a forecast; thresholds move when data are revised.',
    full: 'The curve is a statistical association in past data, not a causal law or a forecast; thresholds move when data are revised.',
  },
  {
    key: 'leakage',
    short:
      'Emissions can fall locally because production moved elsewhere; consumption-based figures can tell another story.',
    full: 'Emissions can fall locally because production moved elsewhere; trade-adjusted (consumption-based) figures can tell a different story.',
  },
  {
    key: 'fragile',
    short:
      'Short series, trending variables and serial correlation make estimates fragile: read the interval, not the point.',
    full: 'Short series, trending variables and serial correlation make estimates fragile; read the interval, not the point.',
  },
  {
    key: 'standards',
    short:
      'It does not replace statutory air-quality standards, the agency’s official methodology or qualified staff; local rules prevail.',
    full: 'It does not replace statutory air-quality standards, the agency’s official methodology, or the judgement of qualified staff; local rules prevail.',
  },
];
