// @ts-check
// Runs the payments fake from environment variables:
//   PAYMENTS_PORT (3430), PAYMENTS_SECRET_KEY (sk_test_latchwork_local),
//   PAYMENTS_WEBHOOK_SECRET (whsec_latchwork_local),
//   PAYMENTS_WEBHOOK_URL (http://127.0.0.1:4200/api/v1/payments/webhook),
//   LW_DATA_DIR (<repo>/.local/data; state goes to its payments/ subfolder).
import { fileURLToPath } from 'node:url';
import { start } from './server.mjs';

const env = process.env;

try {
  const payments = await start({
    port: Number(env['PAYMENTS_PORT'] || 3430),
    secretKey: env['PAYMENTS_SECRET_KEY'] || 'sk_test_latchwork_local',
    webhookSecret: env['PAYMENTS_WEBHOOK_SECRET'] || 'whsec_latchwork_local',
    webhookUrl: env['PAYMENTS_WEBHOOK_URL'] || 'http://127.0.0.1:4200/api/v1/payments/webhook',
    dataDir: env['LW_DATA_DIR'] || fileURLToPath(new URL('../../.local/data', import.meta.url)),
  });
  console.log(`payments listening on ${payments.url}`);
  let closing = false;
  const stop = async () => {
    if (closing) return;
    closing = true;
    try {
      await payments.close();
      process.exit(0);
    } catch (error) {
      console.error('payments: error while closing', error);
      process.exit(1);
    }
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
} catch (error) {
  console.error('payments: could not start:', error);
  process.exit(1);
}
