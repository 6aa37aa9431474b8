// The estimation engine's public surface: every estimator and its pieces (plain functions,
// plain data). See each file's doc comment for the formula and its reference.
export * from './errors';
export * from './types';
export { ModelSpec, CurveRow, PanelRow } from './model-spec';
export type { ModelSpecInput } from './model-spec';
export { parseModelSpec } from './parse-model-spec';
export { prepareRows } from './prepare-rows';
export type { PreparedRows } from './prepare-rows';

// fitting
export { fitCurve } from './fit-curve';
export { fitPanel } from './fit-panel';
export { twoWayWithin } from './two-way-within';
export { fixedEffectsRank } from './fixed-effects-rank';
export { ols } from './ols';
export { fitLeastSquares, FORWARD_ERROR_THRESHOLD, forwardErrorEstimate } from './fit-least-squares';
export { polynomialDesign } from './polynomial-design';

// linear algebra
export { pivotedQr, DEFAULT_RANK_TOLERANCE } from './qr';
export type { QrFactorisation } from './qr';
export { applyQt } from './qr-apply';
export { thinQ } from './thin-q';
export { upperTriangularInverse } from './upper-triangular-inverse';
export { leastSquaresDouble } from './least-squares-double';
export { leastSquaresDoubleDouble } from './least-squares-dd';
export { compensatedResiduals } from './compensated-residuals';
export { realPolynomialRoots } from './real-polynomial-roots';

// covariances
export { robustCovariance } from './robust-covariance';
export { heteroskedasticMeat } from './hc-meat';
export { neweyWestMeat } from './newey-west-meat';
export { clusterMeat } from './cluster-meat';
export { defaultNeweyWestLag } from './newey-west-lag';

// turning points, intervals, tests, readings
export { quadraticTurningPoint } from './turning-point';
export { cubicTurningPoints } from './cubic-turning-points';
export { deltaMethod } from './delta-method';
export { fiellerInterval } from './fieller';
export { cubicFieller } from './cubic-fieller';
export { buildTurningPoints } from './build-turning-points';
export { lindMehlumTest } from './u-test';
export { waldTest } from './wald-test';
export { signRuleReading } from './sign-rule';
export { classifyShape } from './classify-shape';
export { curveInference } from './curve-inference';
export { selectTurningPoint } from './select-turning-point';
export { districtStanding } from './standing';
export { thresholdGap } from './gap';
export { elasticityNow } from './elasticity';
export { incomeTrend } from './income-trend';
export { projectCrossing } from './projection';

// diagnostics
export { durbinWatson } from './durbin-watson';
export { durbinWatsonExactP } from './durbin-watson-exact';
export { symmetricEigenvalues } from './symmetric-eigenvalues';
export { breuschGodfrey } from './breusch-godfrey';
export { breuschPagan } from './breusch-pagan';
export { jarqueBera } from './jarque-bera';
export { curveDiagnostics } from './curve-diagnostics';

// kernels
export { criticalValue, upperTail, twoSidedP, fUpperTail, chiSquareUpperTail } from './distributions';
export { studentTUpperTail } from './student-t-tail';
export { conditionEstimates } from './condition-estimate';
export { acquireWorkspace, releaseWorkspace, take, toArray } from './workspace';
export type { Workspace } from './workspace';
export { twoSum, twoProd, ddAdd, ddMul, ddDiv, ddSqrt } from './double-double';
export type { DD } from './double-double';
