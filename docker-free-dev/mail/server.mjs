// @ts-check
// The mail fake: an SMTP server on 127.0.0.1 that accepts any sender, any recipient and any
// (or no) login, parses each message with mailparser and keeps it (store.mjs). An HTTP side
// shows an inbox page and a JSON API so people and tests can read every e-mail the product sent:
//   GET    /                     inbox page
//   GET    /api/messages         newest first; ?to=<address> filters by recipient
//   GET    /api/messages/:id     one message
//   GET    /api/messages/:id/html   its HTML body, for the inbox's sandboxed iframe
//   GET    /api/messages/:id/raw    the message as received (.eml)
//   DELETE /api/messages         remove every message
//   DELETE /api/messages/:id     remove one
//   GET    /health
import http from 'node:http';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import express from 'express';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { newId, openMailStore } from './store.mjs';

const here = dirname(fileURLToPath(import.meta.url));
const MAX_MESSAGE_BYTES = 25 * 1024 * 1024;

/**
 * @typedef {object} MailOptions
 * @property {number} [smtpPort] 0 picks a free port (tests); default 3425
 * @property {number} [uiPort] 0 picks a free port (tests); default 3426
 * @property {string} [host] default 127.0.0.1
 * @property {string} dataDir root data folder (LW_DATA_DIR); messages go to its mail/ subfolder
 */

/**
 * @param {any} value a mailparser AddressObject (or an array of them)
 * @returns {import('./store.mjs').Address[]}
 */
function addresses(value) {
  if (!value) return [];
  const groups = Array.isArray(value) ? value : [value];
  /** @type {import('./store.mjs').Address[]} */
  const out = [];
  /** @param {any[]} list */
  const walk = (list) => {
    for (const entry of list ?? []) {
      if (entry.group) walk(entry.group);
      else if (entry.address) out.push({ address: entry.address, name: entry.name ?? '' });
    }
  };
  for (const group of groups) walk(group.value);
  return out;
}

/** @param {NodeJS.ReadableStream} stream */
async function readAll(stream) {
  /** @type {Buffer[]} */
  const chunks = [];
  for await (const chunk of stream)
    chunks.push(Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk));
  return Buffer.concat(chunks);
}

/**
 * @param {Buffer} raw
 * @param {any} envelope smtp-server's session.envelope
 * @returns {Promise<import('./store.mjs').StoredMessage>}
 */
async function toMessage(raw, envelope) {
  const parsed = await simpleParser(raw, { skipImageLinks: true, skipTextToHtml: true });
  const to = addresses(parsed.to);
  const cc = addresses(parsed.cc);
  const inHeaders = new Set([...to, ...cc].map((a) => a.address.toLowerCase()));
  /** @type {string[]} */
  const envelopeTo = (envelope.rcptTo ?? []).map((/** @type {any} */ r) => String(r.address));
  return {
    id: newId(),
    receivedAt: new Date().toISOString(),
    date: parsed.date ? parsed.date.toISOString() : null,
    messageId: parsed.messageId ?? null,
    from: addresses(parsed.from)[0] ?? null,
    to,
    cc,
    bcc: envelopeTo
      .filter((address) => !inHeaders.has(address.toLowerCase()))
      .map((address) => ({ address, name: '' })),
    envelope: {
      from: envelope.mailFrom ? String(envelope.mailFrom.address) : null,
      to: envelopeTo,
    },
    subject: parsed.subject ?? '',
    text: parsed.text ?? null,
    html: typeof parsed.html === 'string' ? parsed.html : null,
    attachments: parsed.attachments.map((a) => ({
      filename: a.filename ?? null,
      contentType: a.contentType,
      size: a.size,
      contentId: a.contentId ?? null,
      checksum: a.checksum ?? null,
    })),
    size: raw.length,
  };
}

/**
 * @param {MailOptions} options
 * @returns {Promise<{ url: string, port: number, smtpPort: number, close(): Promise<void> }>}
 */
export async function start(options) {
  const { smtpPort = 3425, uiPort = 3426, host = '127.0.0.1', dataDir } = options;
  if (!dataDir) throw new Error('mail: dataDir is required');
  const store = await openMailStore(join(dataDir, 'mail'));

  const smtp = new SMTPServer({
    name: 'mail.latchwork.test',
    banner: 'Latchwork local mail fake',
    // No TLS on loopback: STARTTLS is not offered, so clients do not try it.
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    allowInsecureAuth: true,
    size: MAX_MESSAGE_BYTES,
    logger: false,
    closeTimeout: 2000,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username ?? 'anyone' });
    },
    onData(stream, session, callback) {
      readAll(stream)
        .then(async (raw) => {
          if (/** @type {any} */ (stream).sizeExceeded) {
            const error = /** @type {Error & { responseCode?: number }} */ (
              new Error('Message exceeds the size limit')
            );
            error.responseCode = 552;
            throw error;
          }
          await store.add(await toMessage(raw, session.envelope), raw);
          callback();
        })
        .catch((error) => {
          if (!error.responseCode) console.error('mail: could not keep a message:', error);
          callback(error);
        });
    },
  });
  smtp.on('error', (error) => console.error('mail: smtp error:', error.message));
  await new Promise((resolve, reject) => {
    smtp.server.once('error', reject);
    smtp.listen(smtpPort, host, () => {
      smtp.server.off('error', reject);
      resolve(undefined);
    });
  });
  const actualSmtpPort = /** @type {import('node:net').AddressInfo} */ (smtp.server.address()).port;

  const app = express();
  app.disable('x-powered-by');
  app.set('query parser', 'simple');
  app.use((_req, res, next) => {
    res.set({ 'X-Content-Type-Options': 'nosniff', 'Cache-Control': 'no-store' });
    next();
  });
  app.get('/health', (_req, res) => {
    res.json({ status: 'ok', smtpPort: actualSmtpPort });
  });
  app.get('/', (_req, res) => {
    res.set(
      'Content-Security-Policy',
      "default-src 'none'; script-src 'self'; style-src 'self'; img-src 'self' data:; connect-src 'self'; frame-src 'self'; base-uri 'none'; form-action 'none'",
    );
    res.sendFile(join(here, 'public', 'inbox.html'));
  });
  app.use('/assets', express.static(join(here, 'public'), { index: false }));

  app.get('/api/messages', (req, res) => {
    const to = typeof req.query['to'] === 'string' ? req.query['to'] : undefined;
    res.json(store.list({ to }));
  });
  app.get('/api/messages/:id', (req, res) => {
    const message = store.get(req.params.id);
    if (!message) {
      res.status(404).json({ error: { code: 'not_found', message: 'No such message' } });
      return;
    }
    res.json(message);
  });
  app.get('/api/messages/:id/html', (req, res) => {
    const message = store.get(req.params.id);
    if (!message) {
      res.status(404).type('text/plain').send('No such message');
      return;
    }
    // Shown inside a sandboxed iframe; the CSP also keeps it from loading anything remote.
    res.set(
      'Content-Security-Policy',
      "sandbox; default-src 'none'; style-src 'unsafe-inline'; img-src data:; font-src data:",
    );
    res.type('html').send(message.html ?? '');
  });
  app.get('/api/messages/:id/raw', async (req, res) => {
    const raw = await store.raw(req.params.id);
    if (!raw) {
      res.status(404).type('text/plain').send('No such message');
      return;
    }
    res.type('message/rfc822').send(raw);
  });
  app.delete('/api/messages', async (_req, res) => {
    res.json({ deleted: await store.clear() });
  });
  app.delete('/api/messages/:id', async (req, res) => {
    if (!(await store.remove(req.params.id))) {
      res.status(404).json({ error: { code: 'not_found', message: 'No such message' } });
      return;
    }
    res.status(204).end();
  });

  const web = http.createServer(app);
  try {
    await new Promise((resolve, reject) => {
      web.once('error', reject);
      web.listen(uiPort, host, () => {
        web.off('error', reject);
        resolve(undefined);
      });
    });
  } catch (error) {
    await new Promise((resolve) => smtp.close(() => resolve(undefined)));
    throw error;
  }
  const actualUiPort = /** @type {import('node:net').AddressInfo} */ (web.address()).port;

  return {
    url: `http://${host}:${actualUiPort}`,
    port: actualUiPort,
    smtpPort: actualSmtpPort,
    async close() {
      await Promise.all([
        new Promise((resolve) => {
          web.close(() => resolve(undefined));
          web.closeAllConnections();
        }),
        new Promise((resolve) => smtp.close(() => resolve(undefined))),
      ]);
    },
  };
}
