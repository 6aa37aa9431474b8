/**
 * The demo region: 24 invented districts with yearly series 1995–2025, drawn from a fixed
 * seed. Every shape the product knows appears (inverted U with the turn inside the range,
 * U, rising, falling, flat, turn beyond the observed range), plus a short series and
 * districts with missing years. Names, places and numbers are invented.
 *
 * Process per district (log scale): ln income follows a linear path plus a random walk;
 * ln emissions = b0 + b1·lx + b2·lx² + 0.1·ln density + AR(1) noise.
 */
import { pressureSeries, type PressureCode } from './pressures';
import { seededRandom, type Random } from './random';

export const DEMO_SEED = 20261201;
export const DEMO_FIRST_YEAR = 1995;
export const DEMO_LAST_YEAR = 2025;

export type DemoShape = 'inverted_u' | 'u' | 'increasing' | 'decreasing' | 'flat' | 'turn_beyond_range';

export interface DemoDistrictSpec {
  code: string;
  name: string;
  shape: DemoShape;
  /** ln income at the first and last year. */
  lxStart: number;
  lxEnd: number;
  /** Turning point on the ln income scale (quadratic shapes). */
  turn?: number;
  /** Curvature b2 (quadratic shapes) or slope b1 (monotone shapes). */
  curvature?: number;
  slope?: number;
  firstYear?: number;
  missingYears?: number[];
  noise?: number;
  /** Income peaks in this year and then falls linearly to lxEnd (a downturn). */
  peakYear?: number;
  lxPeak?: number;
  /** AR(1) coefficient of the emission noise (default 0.5). */
  rho?: number;
  /** Added to the district's own seed (each district draws from its own stream). */
  seedOffset?: number;
}

export const DEMO_DISTRICTS: DemoDistrictSpec[] = [
  { code: 'D01', name: 'Amberlyn Reach', shape: 'inverted_u', lxStart: 9.0, lxEnd: 10.5, turn: 9.75, curvature: -0.6 },
  {
    code: 'D02',
    name: 'Brackenmoor',
    shape: 'inverted_u',
    lxStart: 9.2,
    lxEnd: 10.2,
    turn: 10.25,
    curvature: -0.8,
    seedOffset: 5,
  },
  { code: 'D03', name: 'Cindervale', shape: 'inverted_u', lxStart: 9.4, lxEnd: 10.8, turn: 10.0, curvature: -0.9 },
  { code: 'D04', name: 'Dunmarrow', shape: 'u', lxStart: 8.9, lxEnd: 10.2, turn: 9.55, curvature: 0.9 },
  { code: 'D05', name: 'Elderwick Fen', shape: 'increasing', lxStart: 8.7, lxEnd: 9.9, slope: 0.8 },
  { code: 'D06', name: 'Fallowmere', shape: 'decreasing', lxStart: 9.7, lxEnd: 10.9, slope: -0.7 },
  { code: 'D07', name: 'Glenharrow Flats', shape: 'flat', lxStart: 9.3, lxEnd: 10.1, slope: 0, noise: 0.05, rho: 0 },
  {
    code: 'D08',
    name: 'Hollin Cross',
    shape: 'turn_beyond_range',
    lxStart: 9.1,
    lxEnd: 10.3,
    turn: 11.0,
    curvature: -0.45,
  },
  {
    code: 'D09',
    name: 'Ironbeck',
    shape: 'inverted_u',
    lxStart: 9.1,
    lxEnd: 10.4,
    turn: 9.9,
    curvature: -0.65,
    missingYears: [2008],
  },
  { code: 'D10', name: 'Juniper Hythe', shape: 'increasing', lxStart: 8.8, lxEnd: 9.8, slope: 0.6, firstYear: 2018 },
  { code: 'D11', name: 'Kestrelholm', shape: 'u', lxStart: 9.3, lxEnd: 10.6, turn: 10.0, curvature: 0.45 },
  { code: 'D12', name: 'Larchmoss', shape: 'decreasing', lxStart: 9.9, lxEnd: 11.0, slope: -0.9 },
  // Income rose past the turn, then fell back below it in a downturn: approaching it again.
  {
    code: 'D13',
    name: 'Mirefield Uplands',
    shape: 'inverted_u',
    lxStart: 9.0,
    lxEnd: 9.95,
    turn: 10.12,
    curvature: -1.2,
    peakYear: 2017,
    lxPeak: 10.4,
    noise: 0.02,
  },
  {
    code: 'D14',
    name: 'Nettleby Coast',
    shape: 'flat',
    lxStart: 9.5,
    lxEnd: 10.2,
    slope: 0,
    noise: 0.06,
    rho: 0,
    seedOffset: 1,
  },
  { code: 'D15', name: 'Oxmarsh', shape: 'turn_beyond_range', lxStart: 9.4, lxEnd: 10.6, turn: 11.3, curvature: -0.4 },
  {
    code: 'D16',
    name: 'Pellow Basin',
    shape: 'increasing',
    lxStart: 8.9,
    lxEnd: 10.0,
    slope: 0.5,
    missingYears: [2003, 2004],
  },
  {
    code: 'D17',
    name: 'Quarrendon Hills',
    shape: 'inverted_u',
    lxStart: 9.3,
    lxEnd: 10.7,
    turn: 10.2,
    curvature: -0.55,
  },
  { code: 'D18', name: 'Rushlake', shape: 'decreasing', lxStart: 9.6, lxEnd: 10.7, slope: -0.5, firstYear: 2019 },
  { code: 'D19', name: 'Saltgrave', shape: 'inverted_u', lxStart: 8.8, lxEnd: 10.0, turn: 9.45, curvature: -1.0 },
  {
    code: 'D20',
    name: 'Thornwood Levels',
    shape: 'turn_beyond_range',
    lxStart: 9.0,
    lxEnd: 10.0,
    turn: 8.4,
    curvature: -0.5,
  },
  { code: 'D21', name: 'Umberdale', shape: 'flat', lxStart: 9.2, lxEnd: 9.9, slope: 0, noise: 0.05, rho: 0 },
  { code: 'D22', name: 'Vesperton', shape: 'inverted_u', lxStart: 9.5, lxEnd: 10.9, turn: 10.6, curvature: -1.0 },
  { code: 'D23', name: 'Wyndcombe', shape: 'increasing', lxStart: 9.0, lxEnd: 10.3, slope: 0.7 },
  {
    code: 'D24',
    name: 'Yarrowgate (Jarłowo-Şelé / Жарово)',
    shape: 'inverted_u',
    lxStart: 9.2,
    lxEnd: 10.6,
    turn: 9.95,
    curvature: -0.6,
  },
];

export interface DemoObservation {
  districtCode: string;
  indicator: 'emissions_pc' | 'income_pc' | 'population' | 'pop_density' | PressureCode;
  year: number;
  value: number;
}

export interface DemoRegion {
  districts: { code: string; name: string }[];
  observations: DemoObservation[];
}

const round = (v: number, digits: number): number => Number(v.toFixed(digits));

/** ln income without noise: linear from lxStart to lxEnd, or up to lxPeak and down again. */
function incomePath(spec: DemoDistrictSpec, year: number, first: number): number {
  const span = Math.max(1, DEMO_LAST_YEAR - first);
  if (spec.peakYear === undefined || spec.lxPeak === undefined) {
    return spec.lxStart + ((spec.lxEnd - spec.lxStart) * (year - first)) / span;
  }
  if (year <= spec.peakYear)
    return spec.lxStart + ((spec.lxPeak - spec.lxStart) * (year - first)) / Math.max(1, spec.peakYear - first);
  return (
    spec.lxPeak + ((spec.lxEnd - spec.lxPeak) * (year - spec.peakYear)) / Math.max(1, DEMO_LAST_YEAR - spec.peakYear)
  );
}

interface DistrictDraw {
  observations: DemoObservation[];
  /** the years written, with ln income and density as drawn (the other pressures read them) */
  years: number[];
  lx: number[];
  density: number[];
}

function generateDistrict(spec: DemoDistrictSpec, rng: Random): DistrictDraw {
  const first = spec.firstYear ?? DEMO_FIRST_YEAR;
  const years = DEMO_LAST_YEAR - first + 1;
  const noise = spec.noise ?? 0.03;
  const rho = spec.rho ?? 0.5;
  const area = rng.between(300, 2400); // km²
  let pop = rng.between(40_000, 900_000);
  const popGrowth = rng.between(-0.006, 0.014);
  const meanLevel = rng.between(3, 11); // t CO2 per person

  const b2 = spec.curvature ?? 0;
  const b1 = spec.turn !== undefined ? -2 * b2 * spec.turn : (spec.slope ?? 0);
  const mid = (spec.lxStart + (spec.lxPeak ?? spec.lxEnd)) / 2;
  const curveAtMid = b1 * mid + b2 * mid * mid;
  const b0 = Math.log(meanLevel) - curveAtMid - 0.1 * Math.log(pop / area);

  const out: DemoObservation[] = [];
  const drawn: Omit<DistrictDraw, 'observations'> = { years: [], lx: [], density: [] };
  let walk = 0;
  let u = (rng.normal() * noise) / Math.sqrt(1 - rho * rho);
  // Density wanders on its own (AR(1)), so it is not a copy of the income trend.
  let v = rng.normal() * 0.04;
  for (let i = 0; i < years; i++) {
    const year = first + i;
    if (i > 0) {
      walk += rng.normal() * 0.012;
      u = rho * u + rng.normal() * noise;
      pop *= 1 + popGrowth + rng.normal() * 0.002;
      v = 0.7 * v + rng.normal() * 0.04;
    }
    const lx = incomePath(spec, year, first) + walk;
    const density = (pop / area) * Math.exp(v);
    const ly = b0 + b1 * lx + b2 * lx * lx + 0.1 * Math.log(density) + u;
    if (spec.missingYears?.includes(year)) continue;
    drawn.years.push(year);
    drawn.lx.push(lx);
    drawn.density.push(density);
    const code = spec.code;
    out.push(
      { districtCode: code, indicator: 'emissions_pc', year, value: round(Math.exp(ly), 4) },
      { districtCode: code, indicator: 'income_pc', year, value: round(Math.exp(lx), 0) },
      { districtCode: code, indicator: 'population', year, value: Math.round(pop) },
      { districtCode: code, indicator: 'pop_density', year, value: round(density, 2) },
    );
  }
  return { observations: out, ...drawn };
}

/** The whole demo region for a seed (default DEMO_SEED); the same seed gives the same numbers. */
export function generateDemoRegion(seed = DEMO_SEED): DemoRegion {
  // One stream per district, so tuning one district leaves the others' numbers alone; the
  // other pressures (pressures.ts) draw from streams of their own over the same income path.
  const observations = DEMO_DISTRICTS.flatMap((d, i) => {
    const draw = generateDistrict(d, seededRandom(seed + 7919 * (i + 1) + (d.seedOffset ?? 0)));
    const input = { code: d.code, index: i, years: draw.years, lx: draw.lx, density: draw.density };
    const others = (['pm25', 'so2_pc'] as const).flatMap((p) =>
      pressureSeries(seed, input, p).map((o) => ({ districtCode: d.code, indicator: p, ...o })),
    );
    return [...draw.observations, ...others];
  });
  return { districts: DEMO_DISTRICTS.map(({ code, name }) => ({ code, name })), observations };
}
