// Two jest projects share one jest (~29.7): the app (jest-expo) and the API (ts-jest, node).
const esmOnly = [
  'oauth2-mock-server',
  'jose',
  'ml-regression-.*',
  'ml-array-.*',
  'is-any-array',
  'is-plain-obj',
  '@apidevtools/json-schema-ref-parser',
];
module.exports = {
  // Generous per-test limit: API and browser tests start databases and servers; a 2-core
  // machine under load needs more than jest's 5 s default. Speed is measured in bench/.
  testTimeout: 60000,
  projects: [
    {
      displayName: 'app',
      // The native preset: @testing-library/react-native queries react-native host
      // components, which react-native-web replaces with DOM elements.
      preset: 'jest-expo',
      roots: ['<rootDir>/tests/components'],
      transformIgnorePatterns: [
        'node_modules/(?!((jest-)?react-native|@react-native(-community)?|expo(nent)?|@expo(nent)?/.*|@expo-google-fonts/.*|expo-router|@fontsource/.*|victory|victory-.*|react-native-svg|d3-.*|@tanstack/.*|standard-navigation))',
      ],
      moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1', '\\.(woff2?|ttf)$': '<rootDir>/tests/support/file-stub.js' },
    },
    {
      // Pure engine and reference checks: no database.
      displayName: 'engine',
      testEnvironment: 'node',
      roots: ['<rootDir>/api/estimation', '<rootDir>/tests/reference'],
      testMatch: ['**/*.test.ts'],
      transform: {
        '^.+\\.[tj]sx?$': ['ts-jest', { tsconfig: '<rootDir>/api/tsconfig.json' }],
      },
      transformIgnorePatterns: [`node_modules/(?!(${esmOnly.join('|')})/)`],
    },
    {
      // API tests: supertest against the exported app and a real PostgreSQL.
      displayName: 'api',
      testEnvironment: 'node',
      // tests/security: the hostile-input suite (same database and server as the API tests).
      roots: ['<rootDir>/tests/api', '<rootDir>/tests/security'],
      testMatch: ['**/*.test.ts'],
      // Browser checks in tests/security run with the e2e project (they need the web build).
      testPathIgnorePatterns: ['/node_modules/', '\\.browser\\.test\\.ts$'],
      transform: {
        '^.+\\.[tj]sx?$': ['ts-jest', { tsconfig: '<rootDir>/api/tsconfig.json' }],
      },
      transformIgnorePatterns: [`node_modules/(?!(${esmOnly.join('|')})/)`],
      globalSetup: '<rootDir>/tests/support/global-setup.ts',
      globalTeardown: '<rootDir>/tests/support/global-teardown.ts',
    },
    {
      // Browser tests: the built web app in Debian's Chromium, served by the real API.
      displayName: 'e2e',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/e2e', '<rootDir>/tests/security'],
      testMatch: ['<rootDir>/tests/e2e/**/*.test.ts', '**/*.browser.test.ts'],
      transform: {
        '^.+\\.[tj]sx?$': ['ts-jest', { tsconfig: '<rootDir>/api/tsconfig.json' }],
      },
      transformIgnorePatterns: [`node_modules/(?!(${esmOnly.join('|')})/)`],
      globalSetup: '<rootDir>/tests/support/global-setup.ts',
      globalTeardown: '<rootDir>/tests/support/global-teardown.ts',
    },
  ],
};
