// @ts-check
// Runs the mail fake from environment variables:
//   SMTP_PORT (3425), MAIL_UI_PORT (3426), LW_DATA_DIR (<repo>/.local/data; messages go to its
//   mail/ subfolder).
import { fileURLToPath } from 'node:url';
import { start } from './server.mjs';

const env = process.env;

try {
  const mail = await start({
    smtpPort: Number(env['SMTP_PORT'] || 3425),
    uiPort: Number(env['MAIL_UI_PORT'] || 3426),
    dataDir: env['LW_DATA_DIR'] || fileURLToPath(new URL('../../.local/data', import.meta.url)),
  });
  console.log(`mail listening on ${mail.url}`);
  let closing = false;
  const stop = async () => {
    if (closing) return;
    closing = true;
    try {
      await mail.close();
      process.exit(0);
    } catch (error) {
      console.error('mail: error while closing', error);
      process.exit(1);
    }
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
} catch (error) {
  console.error('mail: could not start:', error);
  process.exit(1);
}
