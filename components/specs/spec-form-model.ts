// The spec editor's draft: text fields as typed, turned into the API body (or problems) on save.
import type { SavedSpec, SpecCovariance, SpecForm, SpecInput, SpecInterval, SpecTransform } from '@/contracts/settings';

export type SpecDraft = {
  name: string;
  description: string;
  emissionsIndicator: string;
  driverIndicator: string;
  controls: string[];
  levelControls: string[];
  form: SpecForm;
  transform: SpecTransform;
  covariance: SpecCovariance;
  intervalMethod: SpecInterval;
  lag: string;
  firstYear: string;
  lastYear: string;
  minYears: string;
};

export const EMPTY_DRAFT: SpecDraft = {
  name: '',
  description: '',
  emissionsIndicator: 'emissions_pc',
  driverIndicator: 'income_pc',
  controls: [],
  levelControls: [],
  form: 'quadratic',
  transform: 'log',
  covariance: 'newey_west',
  intervalMethod: 'fieller',
  lag: '',
  firstYear: '',
  lastYear: '',
  minYears: '',
};

const text = (n: number | null | undefined) => (n === null || n === undefined ? '' : String(n));

export function draftOf(spec: SavedSpec): SpecDraft {
  return {
    name: spec.name,
    description: spec.description,
    emissionsIndicator: spec.emissionsIndicator,
    driverIndicator: spec.driverIndicator,
    controls: spec.controls,
    levelControls: spec.levelControls ?? [],
    form: spec.form,
    transform: spec.transform,
    covariance: spec.covariance,
    intervalMethod: spec.intervalMethod,
    lag: text(spec.lag),
    firstYear: text(spec.firstYear),
    lastYear: text(spec.lastYear),
    minYears: text(spec.minYears),
  };
}

/** A whole number typed into a field: null for blank, NaN for anything that is not one. */
function whole(s: string): number | null {
  const t = s.trim();
  if (t === '') return null;
  return /^\d+$/.test(t) ? Number(t) : Number.NaN;
}

/** The API body, or the problems a person should fix first (field → message). */
export function specInputOf(d: SpecDraft): { input: SpecInput | null; problems: Record<string, string> } {
  const problems: Record<string, string> = {};
  if (!d.name.trim()) problems.name = 'Give the spec a name.';
  if (d.emissionsIndicator === d.driverIndicator)
    problems.driverIndicator = 'The driver must differ from the emissions indicator.';
  const nums = {
    lag: whole(d.lag),
    firstYear: whole(d.firstYear),
    lastYear: whole(d.lastYear),
    minYears: whole(d.minYears),
  };
  for (const [k, v] of Object.entries(nums))
    if (v !== null && Number.isNaN(v)) problems[k] = 'A whole number, or leave it blank.';
  if (nums.firstYear !== null && nums.lastYear !== null && nums.firstYear > nums.lastYear)
    problems.firstYear = 'The first year must not be after the last.';
  if (nums.minYears !== null && !Number.isNaN(nums.minYears) && nums.minYears < 3)
    problems.minYears = 'At least 3 years.';
  if (Object.keys(problems).length) return { input: null, problems };
  const controls = d.controls.filter((c) => c !== d.emissionsIndicator && c !== d.driverIndicator);
  const input: SpecInput = {
    name: d.name.trim(),
    description: d.description.trim(),
    emissionsIndicator: d.emissionsIndicator,
    driverIndicator: d.driverIndicator,
    controls,
    levelControls: d.transform === 'log' ? d.levelControls.filter((c) => controls.includes(c)) : [],
    form: d.form,
    transform: d.transform,
    covariance: d.covariance,
    intervalMethod: d.intervalMethod,
    firstYear: nums.firstYear,
    lastYear: nums.lastYear,
    minYears: nums.minYears,
  };
  if (nums.lag !== null && d.covariance === 'newey_west') input.lag = nums.lag;
  return { input, problems };
}
