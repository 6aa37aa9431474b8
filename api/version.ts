/** The software version recorded with every run and printed on every brief. */
// eslint-disable-next-line @typescript-eslint/no-require-imports
export const SOFTWARE_VERSION: string = require('../package.json').version;
