// Ports, data folders and the environment handed to every process, for the two profiles:
// `dev` (npm start) and `test` (npm test), which use different ports and data folders so
// a test run can go on beside a running demo. Every port can be overridden by a variable.
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

const DEFAULT_PORTS = {
  dev: {
    app: 4200,
    api: 3333,
    idp: 3400,
    s3: 3410,
    smtp: 3425,
    mailUi: 3426,
    payments: 3430,
    pg: 54329,
    redis: 63799,
  },
  test: {
    app: 14200,
    api: 13333,
    idp: 13400,
    s3: 13410,
    smtp: 13425,
    mailUi: 13426,
    payments: 13430,
    pg: 54339,
    redis: 63809,
  },
};

const PORT_VARIABLES = {
  app: 'APP_PORT',
  api: 'API_PORT',
  idp: 'IDP_PORT',
  s3: 'S3_PORT',
  smtp: 'SMTP_PORT',
  mailUi: 'MAIL_UI_PORT',
  payments: 'PAYMENTS_PORT',
  pg: 'PG_PORT',
  redis: 'REDIS_PORT',
};

// Local-only credentials for private clusters bound to 127.0.0.1; never used in production.
const LOCAL_SECRETS = {
  ownerPassword: 'latchwork-owner-local',
  appPassword: 'latchwork-app-local',
  s3AccessKey: 'S3RVER',
  s3SecretKey: 'S3RVER',
  idpClientSecret: 'latchwork-local-client-secret',
  paymentsSecretKey: 'sk_test_latchwork_local',
  paymentsWebhookSecret: 'whsec_latchwork_local',
  sessionSecret: 'latchwork-local-session-secret-change-me',
  idpAdminToken: 'latchwork-local-idp-admin-token',
  idpEventSecret: 'latchwork-local-idp-event-secret',
};

/** @param {'dev'|'test'} profile */
export function loadConfig(profile) {
  const ports = { ...DEFAULT_PORTS[profile] };
  for (const [key, variable] of Object.entries(PORT_VARIABLES)) {
    if (process.env[variable]) ports[key] = Number(process.env[variable]);
  }
  const dataDir = path.join(ROOT, '.local', profile);
  const host = '127.0.0.1';
  const appUrl = `http://${host}:${ports.app}`;
  const pgBase = `${host}:${ports.pg}/latchwork`;
  const env = {
    LW_PROFILE: profile,
    LW_DATA_DIR: dataDir,
    APP_URL: appUrl,
    LW_APP_URL: appUrl,
    APP_PORT: String(ports.app),
    API_PORT: String(ports.api),
    API_URL: `http://${host}:${ports.api}`,
    DATABASE_URL: `postgres://latchwork_app:${LOCAL_SECRETS.appPassword}@${pgBase}`,
    DATABASE_OWNER_URL: `postgres://latchwork_owner:${LOCAL_SECRETS.ownerPassword}@${pgBase}`,
    REDIS_URL: `redis://${host}:${ports.redis}`,
    S3_ENDPOINT: host,
    S3_PORT: String(ports.s3),
    S3_ACCESS_KEY: LOCAL_SECRETS.s3AccessKey,
    S3_SECRET_KEY: LOCAL_SECRETS.s3SecretKey,
    S3_BUCKET: 'latchwork',
    S3_BUCKETS: 'latchwork',
    SMTP_HOST: host,
    SMTP_PORT: String(ports.smtp),
    MAIL_UI_PORT: String(ports.mailUi),
    MAIL_UI_URL: `http://${host}:${ports.mailUi}`,
    MAIL_FROM: 'Latchwork <no-reply@latchwork.test>',
    PAYMENTS_HOST: host,
    PAYMENTS_PORT: String(ports.payments),
    PAYMENTS_SECRET_KEY: LOCAL_SECRETS.paymentsSecretKey,
    PAYMENTS_WEBHOOK_SECRET: LOCAL_SECRETS.paymentsWebhookSecret,
    PAYMENTS_WEBHOOK_URL: `${appUrl}/api/v1/payments/webhook`,
    IDP_PORT: String(ports.idp),
    IDP_ISSUER: `http://${host}:${ports.idp}`,
    IDP_CLIENT_ID: 'latchwork',
    IDP_CLIENT_SECRET: LOCAL_SECRETS.idpClientSecret,
    IDP_REDIRECT_URIS: `${appUrl}/api/v1/auth/callback`,
    IDP_POST_LOGOUT_REDIRECT_URIS: `${appUrl}/`,
    IDP_DATABASE_URL: `postgres://latchwork_owner:${LOCAL_SECRETS.ownerPassword}@${pgBase}`,
    IDP_ADMIN_TOKEN: LOCAL_SECRETS.idpAdminToken,
    IDP_EVENT_SECRET: LOCAL_SECRETS.idpEventSecret,
    IDP_EVENT_URL: `${appUrl}/api/v1/auth/provider-events`,
    SESSION_SECRET: LOCAL_SECRETS.sessionSecret,
  };
  // The identity provider's own tests then also run against PostgreSQL instead of skipping.
  if (profile === 'test') env.LW_TEST_IDP_DATABASE_URL = env.DATABASE_OWNER_URL;
  return { profile, ports, dataDir, host, env, secrets: LOCAL_SECRETS };
}
