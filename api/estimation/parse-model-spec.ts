import { EstimationInputError } from './errors';
import { ModelSpec, type ModelSpecInput } from './model-spec';

/**
 * Validates a model spec and fills in its defaults (model-spec.ts), turning zod's issues
 * into the engine's error.
 *
 * Formula: none — ModelSpec.safeParse plus the cross-field rule that a control cannot be
 * both unused and listed in levelControls when `controls` is given.
 * Reference: docs/method.md.
 *
 * Throws: EstimationInputError `invalid_argument` with details { reason: 'model', issues }.
 *
 * Example:
 *   parseModelSpec({ form: 'quadratic', transform: 'log', covariance: 'hc1' }).level   // → 0.95
 *   parseModelSpec({ form: 'quartic' })   // throws invalid_argument (issues list form, transform, covariance)
 */
export function parseModelSpec(model: ModelSpecInput | ModelSpec): ModelSpec {
  const r = ModelSpec.safeParse(model);
  if (!r.success) {
    const issues = r.error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message }));
    throw new EstimationInputError(
      'invalid_argument',
      `Invalid model spec: ${issues.map((i) => `${i.path || '(root)'}: ${i.message}`).join('; ')}`,
      { reason: 'model', issues },
    );
  }
  const spec = r.data;
  if (spec.controls) {
    const unknown = spec.levelControls.filter((c) => !spec.controls!.includes(c));
    if (unknown.length > 0) {
      throw new EstimationInputError(
        'invalid_argument',
        `levelControls names controls not in controls: ${unknown.join(', ')}`,
        { reason: 'model', issues: [{ path: 'levelControls', message: `not in controls: ${unknown.join(', ')}` }] },
      );
    }
  }
  return spec;
}
