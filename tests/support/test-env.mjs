// Prints the test profile's environment as shell assignments, for running one test file by hand
// against a stack started on the test profile:  eval "$(node tests/support/test-env.mjs)"
import { loadConfig } from '../../docker-free-dev/lib/config.mjs';

const quote = (v) => `'${String(v).replaceAll("'", `'\\''`)}'`;
for (const [key, value] of Object.entries(loadConfig('test').env))
  console.log(`export ${key}=${quote(value)}`);
