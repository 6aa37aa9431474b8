// ESLint 9 flat config: Expo's rules, typescript-eslint's recommended rules, and the
// project's own rules (eslint/plugin.js): SQL only in stores, features talk through services.
const { defineConfig, globalIgnores } = require('eslint/config');
const expoConfig = require('eslint-config-expo/flat');
const tseslint = require('typescript-eslint');
const crestwatch = require('./eslint/plugin');
const pending = require('./eslint/pending');

module.exports = defineConfig([
  globalIgnores([
    'dist/**',
    'node_modules/**',
    '.expo/**',
    '.data/**',
    'tests/artifacts/**',
    'coverage/**',
    'expo-env.d.ts',
  ]),
  expoConfig,
  tseslint.configs.recommended,
  {
    plugins: { crestwatch },
  },
  {
    // Node's CommonJS config files (this one, Metro's, Babel's, Jest's, the local plugin).
    files: ['*.js', 'eslint/**/*.js'],
    languageOptions: {
      sourceType: 'commonjs',
      globals: {
        require: 'readonly',
        module: 'writable',
        exports: 'writable',
        __dirname: 'readonly',
        process: 'readonly',
        console: 'readonly',
      },
    },
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
  {
    // Metro resolves `require()` of assets (fonts) and of modules loaded on demand; an
    // `import` would pull them into the first bundle.
    files: ['app/**', 'components/**', 'hooks/**', 'lib/**'],
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
  {
    // expo-router's package index re-exports every layout it ships, and Metro keeps all of
    // them: screens take routing from lib/router.ts, which imports only what the app uses.
    files: ['app/**', 'components/**', 'hooks/**', 'lib/**'],
    ignores: ['app/+html.tsx'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: [
            {
              name: 'expo-router',
              message: 'import routing from @/lib/router (keeps unused layouts out of the first bundle)',
            },
          ],
        },
      ],
    },
  },
  {
    // SQL lives in stores; migrations, scripts, tests and benchmarks may query directly, and
    // api/db.ts / api/db/ are the database layer itself (the Knex factory, advisory locks).
    files: ['**/*.{js,ts,tsx}'],
    ignores: [
      'migrations/**',
      'scripts/**',
      'tests/**',
      'bench/**',
      'api/db.ts',
      'api/db/**',
      'knexfile.ts',
      'eslint/**',
      'eslint.config.js',
    ],
    rules: { 'crestwatch/sql-in-stores': 'error' },
  },
  {
    files: ['api/**/*.ts'],
    rules: { 'crestwatch/feature-boundaries': 'error' },
  },
  // Pending refactor — must be empty (see eslint/pending.js).
  ...Object.entries(pending.RULES_OFF).map(([rule, files]) => ({ files, rules: { [rule]: 'off' } })),
]);
