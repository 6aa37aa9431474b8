/** The test cluster stays up between runs (a warm start is faster); `npm test` stops it. */
export default function globalTeardown(): void {}
