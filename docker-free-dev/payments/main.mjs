// @ts-check
// Runs the payments fake from environment variables:
//   PAYMENTS_PORT (3430), PAYMENTS_SECRET_KEY (sk_test_latchwork_local),
//   PAYMENTS_WEBHOOK_SECRET (whsec_latchwork_local),
//   PAYMENTS_WEBHOOK_URL (http://127.0.0.1:4200/api/v1/payments/webhook),
//   LW_DATA_DIR (<repo>/.local/data; state goes to its payments/ subfolder).
import { defaultDataDir, runFake } from '../lib/run-fake.mjs';
import { start } from './server.mjs';

const env = process.env;

await runFake('payments', () =>
  start({
    port: Number(env['PAYMENTS_PORT'] || 3430),
    secretKey: env['PAYMENTS_SECRET_KEY'] || 'sk_test_latchwork_local',
    webhookSecret: env['PAYMENTS_WEBHOOK_SECRET'] || 'whsec_latchwork_local',
    webhookUrl: env['PAYMENTS_WEBHOOK_URL'] || 'http://127.0.0.1:4200/api/v1/payments/webhook',
    dataDir: defaultDataDir(),
  }),
);
