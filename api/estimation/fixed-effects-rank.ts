/**
 * Number of parameters absorbed by unit and period fixed effects: G + T − C, with C the
 * number of connected components of the bipartite unit–period graph (one edge per
 * observed row). For a connected panel (every balanced one) this is G + T − 1.
 *
 * Formula: rank of [D_unit, D_period] = G + T − C (each component loses one dimension to
 * the common constant); components by union–find with path halving.
 * Reference: Abowd, J. M., Creecy, R. H. and Kramarz, F. (2002), "Computing person and
 * firm effects using linked longitudinal employer-employee data", US Census Bureau
 * Technical Paper TP-2002-06 (connectedness and identification of two-way effects).
 *
 * Throws: nothing.
 *
 * Example: units (0, 1), periods (0, 1): two separate components → fixedEffectsRank(...) = 2 + 2 − 2 = 2
 */
export function fixedEffectsRank(
  unit: Int32Array,
  period: Int32Array,
  nUnits: number,
  nPeriods: number,
): { rank: number; components: number } {
  const parent = Int32Array.from({ length: nUnits + nPeriods }, (_, i) => i);
  const find = (a: number): number => {
    while (parent[a] !== a) {
      parent[a] = parent[parent[a]];
      a = parent[a];
    }
    return a;
  };
  for (let i = 0; i < unit.length; i++) {
    const a = find(unit[i]),
      b = find(nUnits + period[i]);
    if (a !== b) parent[a] = b;
  }
  let components = 0;
  for (let v = 0; v < nUnits + nPeriods; v++) if (find(v) === v) components++;
  return { rank: nUnits + nPeriods - components, components };
}
