// @ts-check
// Runs the mail fake from environment variables:
//   SMTP_PORT (3425), MAIL_UI_PORT (3426), LW_DATA_DIR (<repo>/.local/data; messages go to its
//   mail/ subfolder).
import { defaultDataDir, runFake } from '../lib/run-fake.mjs';
import { start } from './server.mjs';

const env = process.env;

await runFake('mail', () =>
  start({
    smtpPort: Number(env['SMTP_PORT'] || 3425),
    uiPort: Number(env['MAIL_UI_PORT'] || 3426),
    dataDir: defaultDataDir(),
  }),
);
