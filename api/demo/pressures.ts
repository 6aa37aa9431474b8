/**
 * The demo region's other watched pressures: invented PM2.5 (annual mean concentration,
 * µg/m³) and SO2 per person (kg per person) for every demo district, each with its own
 * shape against the district's income, so the three tracks tell different stories in some
 * districts. Names and numbers are invented.
 *
 * Process per district and pressure (log scale), over the district's own income path
 * (ln income as the CO2 series drew it): ln y = c0 + c1·lx + c2·lx² + 0.1·ln density + AR(1)
 * noise, from a random stream of its own (so CO2's numbers are not touched by these).
 *
 * Chosen disagreements (tests/api/demo-tracks.test.ts holds them, with the starting spec):
 * - D13 Mirefield Uplands: approaching its CO2 threshold again after its downturn, but past
 *   the turn for PM2.5 (its PM2.5 turned at a lower income).
 * - D22 Vesperton: past the turn for CO2, at the turn for PM2.5 (its PM2.5 turns near
 *   today's income); assets/demo-data/pm25-revision-2025.csv moves it past the PM2.5 turn.
 * - D07 Glenharrow Flats: SO2 monitoring started in 2022, too short for its own curve (not
 *   estimable on its own; the regional curve stands in), while CO2 and PM2.5 have their own.
 */
import { seededRandom } from './random';

export type PressureCode = 'pm25' | 'so2_pc';

export interface PressureShape {
  /** ln income where the curve peaks (or bottoms); absent: monotone with `slope`. */
  turn?: number;
  curvature?: number;
  slope?: number;
  /** typical level in the indicator's unit */
  meanLevel: number;
  noise?: number;
  /** the series starts in this year (monitoring began late) */
  firstYear?: number;
}

/** Per district: PM2.5 and SO2 shapes. The turn is on the ln income scale, like generate.ts. */
export const PRESSURE_SHAPES: Record<string, Record<PressureCode, PressureShape>> = {
  D01: { pm25: { turn: 9.6, curvature: -0.7, meanLevel: 18 }, so2_pc: { slope: -0.9, meanLevel: 12 } },
  D02: { pm25: { turn: 9.5, curvature: -1.4, meanLevel: 22, noise: 0.02 }, so2_pc: { slope: -0.6, meanLevel: 9 } },
  D03: { pm25: { turn: 10.0, curvature: -0.8, meanLevel: 15 }, so2_pc: { turn: 9.8, curvature: -0.7, meanLevel: 14 } },
  D04: { pm25: { slope: 0, meanLevel: 11, noise: 0.04 }, so2_pc: { slope: -0.8, meanLevel: 7 } },
  D05: { pm25: { slope: 0.7, meanLevel: 24 }, so2_pc: { slope: 0.9, meanLevel: 16 } },
  D06: { pm25: { slope: -0.8, meanLevel: 12 }, so2_pc: { slope: -1.1, meanLevel: 5 } },
  D07: {
    pm25: { turn: 9.6, curvature: -0.9, meanLevel: 19 },
    so2_pc: { slope: -0.5, meanLevel: 8, firstYear: 2022 },
  },
  D08: { pm25: { turn: 9.7, curvature: -0.8, meanLevel: 20 }, so2_pc: { slope: 0.4, meanLevel: 11 } },
  D09: { pm25: { turn: 9.9, curvature: -0.7, meanLevel: 17 }, so2_pc: { turn: 9.6, curvature: -0.9, meanLevel: 13 } },
  D10: { pm25: { slope: 0.5, meanLevel: 26 }, so2_pc: { slope: 0.6, meanLevel: 18 } },
  D11: { pm25: { slope: -0.6, meanLevel: 14 }, so2_pc: { turn: 10.1, curvature: 0.6, meanLevel: 6 } },
  D12: { pm25: { slope: -1.0, meanLevel: 9 }, so2_pc: { slope: -1.2, meanLevel: 4 } },
  D13: { pm25: { turn: 9.7, curvature: -1.1, meanLevel: 21, noise: 0.02 }, so2_pc: { slope: -0.4, meanLevel: 10 } },
  D14: { pm25: { slope: 0, meanLevel: 10, noise: 0.05 }, so2_pc: { slope: 0, meanLevel: 6, noise: 0.05 } },
  D15: { pm25: { turn: 10.2, curvature: -0.6, meanLevel: 16 }, so2_pc: { turn: 9.9, curvature: -0.8, meanLevel: 12 } },
  D16: { pm25: { slope: 0.6, meanLevel: 28 }, so2_pc: { slope: 0.5, meanLevel: 20 } },
  D17: { pm25: { turn: 9.8, curvature: -0.7, meanLevel: 17 }, so2_pc: { turn: 10.4, curvature: -0.6, meanLevel: 11 } },
  D18: { pm25: { slope: -0.5, meanLevel: 13 }, so2_pc: { slope: -0.7, meanLevel: 7 } },
  D19: { pm25: { turn: 9.3, curvature: -1.0, meanLevel: 25 }, so2_pc: { turn: 9.4, curvature: -1.0, meanLevel: 15 } },
  D20: { pm25: { slope: -0.7, meanLevel: 14 }, so2_pc: { slope: -0.9, meanLevel: 9 } },
  D21: { pm25: { slope: 0, meanLevel: 12, noise: 0.05 }, so2_pc: { slope: 0.3, meanLevel: 8 } },
  D22: {
    pm25: { turn: 10.75, curvature: -1.2, meanLevel: 19, noise: 0.02 },
    so2_pc: { turn: 10.0, curvature: -0.8, meanLevel: 13 },
  },
  D23: { pm25: { slope: 0.6, meanLevel: 23 }, so2_pc: { turn: 9.6, curvature: -0.7, meanLevel: 14 } },
  D24: { pm25: { turn: 9.8, curvature: -0.8, meanLevel: 18 }, so2_pc: { slope: -0.6, meanLevel: 10 } },
};

/** Stream offsets: far from the CO2 stream's seed + 7919·(i + 1) + small offsets. */
const STREAM: Record<PressureCode, number> = { pm25: 104_729, so2_pc: 1_299_709 };

export interface PressureInput {
  code: string;
  /** the district's index in DEMO_DISTRICTS (its stream) */
  index: number;
  years: number[];
  /** ln income and density per year, as the district's CO2 series used them */
  lx: number[];
  density: number[];
}

const round = (v: number, digits: number): number => Number(v.toFixed(digits));

/** One pressure's series for one district: [year, value] pairs. */
export function pressureSeries(
  seed: number,
  d: PressureInput,
  pressure: PressureCode,
): { year: number; value: number }[] {
  const shape = PRESSURE_SHAPES[d.code]?.[pressure];
  if (!shape || d.years.length === 0) return [];
  const rng = seededRandom(seed + 7919 * (d.index + 1) + STREAM[pressure]);
  const noise = shape.noise ?? 0.03;
  const rho = 0.5;
  const b2 = shape.curvature ?? 0;
  const b1 = shape.turn !== undefined ? -2 * b2 * shape.turn : (shape.slope ?? 0);
  const lo = Math.min(...d.lx);
  const hi = Math.max(...d.lx);
  const mid = (lo + hi) / 2;
  const meanDensity = d.density.reduce((a, b) => a + b, 0) / d.density.length;
  const b0 = Math.log(shape.meanLevel) - (b1 * mid + b2 * mid * mid) - 0.1 * Math.log(meanDensity);
  let u = (rng.normal() * noise) / Math.sqrt(1 - rho * rho);
  const out: { year: number; value: number }[] = [];
  for (let i = 0; i < d.years.length; i++) {
    if (i > 0) u = rho * u + rng.normal() * noise;
    if (shape.firstYear !== undefined && d.years[i] < shape.firstYear) continue;
    const lx = d.lx[i];
    const ly = b0 + b1 * lx + b2 * lx * lx + 0.1 * Math.log(d.density[i]) + u;
    out.push({ year: d.years[i], value: round(Math.exp(ly), pressure === 'pm25' ? 2 : 3) });
  }
  return out;
}
