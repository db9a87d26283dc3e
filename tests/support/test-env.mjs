// Prints a profile's environment as shell assignments, for running one test file by hand
// against a running stack: eval "$(node tests/support/test-env.mjs)" for the test profile,
// or `… test-env.mjs dev` for the demo started by `npm start`.
import { loadConfig } from '../../docker-free-dev/lib/config.mjs';

const quote = (v) => `'${String(v).replaceAll("'", `'\\''`)}'`;
for (const [key, value] of Object.entries(
  loadConfig(process.argv[2] === 'dev' ? 'dev' : 'test').env,
))
  console.log(`export ${key}=${quote(value)}`);
