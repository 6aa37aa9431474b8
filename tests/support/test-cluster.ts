/** The test suite's own PostgreSQL: its own data dir and port, so it runs beside the demo. */
import { TEST_DB_PORT, demoDatabaseUrl } from '../../api/config';
import type { ClusterOptions } from '../../scripts/pg';

export const TEST_CLUSTER: ClusterOptions = { name: 'test', port: TEST_DB_PORT, fast: true };
export const TEMPLATE_DB = 'crestwatch_template';
export const testDatabaseUrl = (db: string) => demoDatabaseUrl(TEST_DB_PORT, db);
