import { defineConfig, mergeConfig } from 'vitest/config';
import base from '../../vite.config.js';

/**
 * `npm run test:pg`: the API and security test files as they are, on a PostgreSQL database per test app
 * (TEST_DATABASE_URL, set by tests/tools/pg-cluster.sh), plus the PostgreSQL-only checks in tests/pg/*.pg-test.ts,
 * which the SQLite run leaves out because they need the cluster.
 */
export default mergeConfig(base, defineConfig({
  test: {
    include: ['tests/api/**/*.test.ts', 'tests/security/**/*.test.ts', 'tests/pg/**/*.pg-test.ts'],
    testTimeout: 60_000,
  },
}));
