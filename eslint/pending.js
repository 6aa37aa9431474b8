/**
 * Files that still break a Crestwatch lint rule because their feature has not been
 * reshaped yet. Pending refactor — must be empty: remove an entry when its file is fixed,
 * never add one.
 */

/** Files with SQL outside a store (`crestwatch/sql-in-stores`). */
const SQL_OUTSIDE_STORES = [];

/** "api/<file> -> api/<other feature's store>" imports (`crestwatch/feature-boundaries`). */
const FOREIGN_STORE_IMPORTS = [];

/** Feature folder pairs that import each other, "a<->b" in alphabetical order. */
const MUTUAL_FOLDER_IMPORTS = [];

/**
 * Findings of the general rules (Expo's, typescript-eslint's) in files being changed
 * elsewhere at the time lint arrived: rule → files where it is off for now.
 */
const RULES_OFF = {
  '@typescript-eslint/no-explicit-any': ['api/uploads/store.ts'],
  '@typescript-eslint/no-unused-vars': ['tests/api/estimate.test.ts'],
};

module.exports = { SQL_OUTSIDE_STORES, FOREIGN_STORE_IMPORTS, MUTUAL_FOLDER_IMPORTS, RULES_OFF };
