/**
 * The indicator catalogue's rules: what a derivation may be built from, when a positivity
 * rule can be switched on, and that defining or changing a derivation recomputes the
 * series in the database (a change set of its own, in history, revertable). Every change
 * is audited in the transaction that makes it.
 */
import type { Knex } from 'knex';
import * as audit from '../audit/service';
import { AppError, NotFoundError } from '../http/errors';
import { recomputeDerivedIndicator } from '../uploads/change-sets';
import type { UploadSummary } from '../uploads/present';
import type { Who } from '../uploads/service';
import { inTransaction, withConnection, type Sql } from '../db/connection';
import type { CreateIndicator, DerivationInput, UpdateIndicator } from './schema';
import * as store from './store';

export interface IndicatorView {
  code: string;
  name: string;
  unit: string;
  description: string;
  mustBePositive: boolean;
  /** who publishes the series (e.g. a statistics office), and under which terms it may be used */
  source: string | null;
  licence: string | null;
  derivation:
    | null
    | { kind: 'per_person'; source: string; divisor: string; formula: string }
    | { kind: 'real_from_nominal'; source: string; divisor: string; baseYear: number; formula: string }
    | { kind: 'from_boundaries'; measure: 'area_km2'; formula: string }
    | { kind: 'ratio'; source: string; divisor: string; formula: string };
  stats: store.IndicatorRow['stats'];
}

export function viewOf(r: store.IndicatorRow): IndicatorView {
  let derivation: IndicatorView['derivation'] = null;
  if (r.derivation === 'per_person') {
    derivation = {
      kind: 'per_person',
      source: r.sourceCode!,
      divisor: r.divisorCode!,
      formula: `${r.sourceCode} ÷ ${r.divisorCode}`,
    };
  } else if (r.derivation === 'from_boundaries') {
    derivation = {
      kind: 'from_boundaries',
      measure: 'area_km2',
      formula: 'land area of the district’s current boundary, km² (on the ellipsoid)',
    };
  } else if (r.derivation === 'ratio') {
    derivation = {
      kind: 'ratio',
      source: r.sourceCode!,
      divisor: r.divisorCode!,
      formula: `${r.sourceCode} ÷ ${r.divisorCode}`,
    };
  } else if (r.derivation === 'real_from_nominal') {
    derivation = {
      kind: 'real_from_nominal',
      source: r.sourceCode!,
      divisor: r.divisorCode!,
      baseYear: r.baseYear!,
      formula: `${r.sourceCode} ÷ ${r.divisorCode} × 100 (${r.divisorCode} = 100 in ${r.baseYear})`,
    };
  }
  const { code, name, unit, description, mustBePositive, source, licence, stats } = r;
  return { code, name, unit, description, mustBePositive, source, licence, derivation, stats };
}

export async function listIndicators(db: Knex) {
  return { indicators: (await store.listIndicators(db)).map(viewOf) };
}

export interface IndicatorAnswer {
  indicator: IndicatorView;
  /** The change set that recomputed the derived series, when values changed. */
  recomputed: UploadSummary | null;
}

export async function createIndicator(db: Knex, body: CreateIndicator, who: Who): Promise<IndicatorAnswer> {
  return withConnection(db, (conn) =>
    inTransaction(conn, async () => {
      if (await store.findIndicator(conn, body.code)) {
        throw new AppError(409, 'indicator_exists', `There is already an indicator ${body.code}.`, { code: body.code });
      }
      const sources = await resolveDerivation(conn, body.code, body.derivation);
      await store.insertIndicator(conn, body.code, {
        name: body.name,
        unit: body.unit,
        description: body.description,
        mustBePositive: body.mustBePositive,
        source: body.source,
        licence: body.licence,
        ...sources,
      });
      const created = (await store.findIndicator(conn, body.code))!;
      const recomputed = body.derivation ? await recomputeDerivedIndicator(conn, created.id, created.code, who) : null;
      const indicator = viewOf((await store.findIndicator(conn, body.code))!);
      await audit.recordOn(conn, {
        actorId: who.id,
        actorEmail: who.email,
        action: 'indicator.create',
        targetType: 'indicator',
        targetId: body.code,
        after: indicator,
      });
      return { indicator, recomputed };
    }),
  );
}

export async function updateIndicator(
  db: Knex,
  code: string,
  body: UpdateIndicator,
  who: Who,
): Promise<IndicatorAnswer> {
  return withConnection(db, (conn) =>
    inTransaction(conn, async () => {
      const cur = await store.findIndicator(conn, code, { forUpdate: true });
      if (!cur) throw new NotFoundError(`No indicator ${code}`, { code });
      const before = viewOf(cur);
      const mustBePositive = body.mustBePositive ?? cur.mustBePositive;
      if (mustBePositive && !cur.mustBePositive) {
        const bad = await store.nonPositiveValues(conn, cur.id);
        if (bad.count > 0) {
          const s = bad.sample[0];
          throw new AppError(
            409,
            'values_not_positive',
            `${code} holds ${bad.count} values ≤ 0 (e.g. ${s.district} ${s.year}: ${s.value}); fix them before making it positive-only.`,
            bad,
          );
        }
      }
      const derivationChanged =
        body.derivation !== undefined && JSON.stringify(body.derivation) !== JSON.stringify(inputOf(before.derivation));
      if (derivationChanged && body.derivation && cur.derivation === 'none' && cur.stats.values > 0) {
        throw new AppError(
          409,
          'has_uploaded_values',
          `${code} holds ${cur.stats.values} uploaded values; a derived series is computed, never typed by hand. Define the derivation under a new code.`,
          { code, values: cur.stats.values },
        );
      }
      if (derivationChanged && body.derivation) {
        const users = await store.dependents(conn, cur.id);
        if (users.length) {
          throw new AppError(
            409,
            'is_a_source',
            `${code} is a source of ${users.join(', ')}: a source cannot itself be derived.`,
            { code, dependents: users },
          );
        }
      }
      const sources = body.derivation === undefined ? keep(cur) : await resolveDerivation(conn, code, body.derivation);
      await store.updateIndicator(conn, cur.id, {
        name: body.name ?? cur.name,
        unit: body.unit ?? cur.unit,
        description: body.description ?? cur.description,
        mustBePositive,
        source: body.source !== undefined ? body.source : cur.source,
        licence: body.licence !== undefined ? body.licence : cur.licence,
        ...sources,
      });
      const recomputed =
        derivationChanged && body.derivation ? await recomputeDerivedIndicator(conn, cur.id, code, who) : null;
      const indicator = viewOf((await store.findIndicator(conn, code))!);
      await audit.recordOn(conn, {
        actorId: who.id,
        actorEmail: who.email,
        action: 'indicator.update',
        targetType: 'indicator',
        targetId: code,
        before,
        after: indicator,
      });
      return { indicator, recomputed };
    }),
  );
}

function inputOf(d: IndicatorView['derivation']): DerivationInput | null {
  if (!d) return null;
  if (d.kind === 'from_boundaries') return { kind: 'from_boundaries', measure: 'area_km2' };
  if (d.kind === 'ratio') return { kind: 'ratio', source: d.source, divisor: d.divisor };
  return d.kind === 'per_person'
    ? { kind: 'per_person', source: d.source, divisor: d.divisor }
    : { kind: 'real_from_nominal', source: d.source, divisor: d.divisor, baseYear: d.baseYear };
}

function keep(cur: store.IndicatorRow) {
  return { derivation: cur.derivation, sourceId: cur.sourceId, divisorId: cur.divisorId, baseYear: cur.baseYear };
}

async function resolveDerivation(conn: Sql, code: string, d: DerivationInput | null) {
  if (!d) return { derivation: 'none' as const, sourceId: null, divisorId: null, baseYear: null };
  if (d.kind === 'from_boundaries')
    return { derivation: 'from_boundaries' as const, sourceId: null, divisorId: null, baseYear: null };
  if (d.source === code || d.divisor === code || d.source === d.divisor) {
    throw new AppError(
      422,
      'bad_derivation',
      'A derivation needs two different indicators, neither of them the derived one.',
      { derivation: d },
    );
  }
  const source = await store.findIndicator(conn, d.source);
  const divisor = await store.findIndicator(conn, d.divisor);
  const missing = [!source ? d.source : null, !divisor ? d.divisor : null].filter(Boolean);
  if (missing.length)
    throw new AppError(422, 'bad_derivation', `No indicator ${missing.join(' or ')} to derive from.`, { missing });
  // A ratio may read land area from the boundaries; everything else derives from uploaded series.
  const derived = [source!, divisor!]
    .filter((s) => s.derivation !== 'none' && !(d.kind === 'ratio' && s.derivation === 'from_boundaries'))
    .map((s) => s.code);
  if (derived.length)
    throw new AppError(
      422,
      'bad_derivation',
      `${derived.join(' and ')} ${derived.length > 1 ? 'are' : 'is'} derived: derive only from uploaded series.`,
      { derived },
    );
  if (!divisor!.mustBePositive) {
    throw new AppError(
      422,
      'bad_derivation',
      `The divisor ${divisor!.code} must be a positive-only indicator, so the division is always defined.`,
      { divisor: divisor!.code },
    );
  }
  return {
    derivation: d.kind,
    sourceId: source!.id,
    divisorId: divisor!.id,
    baseYear: d.kind === 'real_from_nominal' ? d.baseYear : null,
  };
}

/** The codes among these that the indicator catalogue knows. */
export function knownIndicatorCodes(db: Knex, codes: string[]): Promise<string[]> {
  return store.existingCodes(db, codes);
}
