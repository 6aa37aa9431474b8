// The one module the card's charts load after mount: both drawings in one async chunk, so
// the SVG and chart code is neither in the first route's bundle nor in a shared chunk that
// the page would load up front.
export { default as CurveChartSvg } from './curve-chart-svg';
export { default as PathChartSvg } from './path-chart-svg';
