// Password-set tickets of the identity-provider fake: the admin call the API makes when an owner
// invites someone (libs/identity/server idp-admin.ts), and the set-password page at the link.
// Runs on the JSON store, and on PostgreSQL too when LW_TEST_IDP_DATABASE_URL is set.
import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { setPassword } from '../../docker-free-dev/identity-provider/accounts.mjs';
import {
  AFTER_LOGOUT,
  Browser,
  type Discovery,
  type Idp,
  startIdp,
} from './identity-provider-support';
import { foreignUrls, must, tempDataDir } from './support';

const ADMIN_TOKEN = 'test-admin-token';
const RETURN_TO = `${AFTER_LOGOUT}api/v1/auth/login`;
const GONE =
  'This link has expired or has already been used. Ask the person who invited you to send a new one.';
const databaseUrl = process.env['LW_TEST_IDP_DATABASE_URL'];
const stores = [
  { store: 'JSON file', databaseUrl: undefined },
  ...(databaseUrl ? [{ store: 'PostgreSQL', databaseUrl }] : []),
];

describe.each(stores)('password-set tickets ($store)', ({ databaseUrl }) => {
  const run = Date.now().toString(36);
  const email = (who: string) => `${who}-${run}@wexbridge-tiling.test`;
  let data: Awaited<ReturnType<typeof tempDataDir>>;
  let idp: Idp;
  let discovery: Discovery;
  let clock = Date.now();

  beforeAll(async () => {
    data = await tempDataDir('idp-tickets');
    ({ idp, discovery } = await startIdp({
      dataDir: data.dir,
      databaseUrl,
      adminToken: ADMIN_TOKEN,
      now: () => new Date(clock),
    }));
  });

  afterAll(async () => {
    await idp?.close();
    await data?.remove();
    if (databaseUrl) {
      const pool = new pg.Pool({ connectionString: databaseUrl });
      await pool.query('delete from idp.account where email like $1', [`%-${run}@%`]);
      await pool.query('delete from idp.password_ticket where email like $1', [`%-${run}@%`]);
      await pool.end();
    }
  });

  function createTicket(body: Record<string, unknown>, token: string | null = ADMIN_TOKEN) {
    return fetch(`${idp.url}/admin/password-tickets`, {
      method: 'POST',
      headers: {
        'content-type': 'application/json',
        ...(token === null ? {} : { authorization: `Bearer ${token}` }),
      },
      body: JSON.stringify({ returnTo: RETURN_TO, expiresInSeconds: 3600, name: '', ...body }),
    });
  }

  async function ticketFor(who: string, name = '', expiresInSeconds = 3600) {
    const response = await createTicket({ email: email(who), name, expiresInSeconds });
    expect(response.status).toBe(201);
    return (await response.json()) as { url: string; expiresAt: string; accountExists: boolean };
  }

  function submit(url: string, password: string, repeat = password) {
    return fetch(url, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ email: 'ignored@elsewhere.test', password, repeat }),
    });
  }

  /** What the store keeps of a ticket: its SHA-256, never the ticket. */
  async function storedTicketHashes(): Promise<string[]> {
    if (databaseUrl) {
      const pool = new pg.Pool({ connectionString: databaseUrl });
      const { rows } = await pool.query('select token_hash from idp.password_ticket');
      await pool.end();
      return rows.map((r) => r.token_hash);
    }
    const file = join(data.dir, 'identity-provider', 'password-tickets.json');
    const text = await readFile(file, 'utf8');
    return JSON.parse(text).tickets.map((t: { tokenHash: string }) => t.tokenHash);
  }

  it('refuses the admin call without the right bearer token', async () => {
    expect((await createTicket({ email: email('x') }, null)).status).toBe(401);
    const wrong = await createTicket({ email: email('x') }, 'not-the-token');
    expect(wrong.status).toBe(401);
    expect(await wrong.json()).toEqual({
      error: expect.objectContaining({ code: 'unauthenticated' }),
    });
  });

  it('names the field of a bad admin request, and sends people back only to the app', async () => {
    const bad = await createTicket({ email: 'not-an-address' });
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.details.problems[0].path).toBe('email');
    const away = await createTicket({ email: email('y'), returnTo: 'https://elsewhere.test/' });
    expect(away.status).toBe(400);
    expect((await away.json()).error.message).toMatch(/^returnTo/);
    const unreadable = await fetch(`${idp.url}/admin/password-tickets`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', authorization: `Bearer ${ADMIN_TOKEN}` },
      body: '{not json',
    });
    expect(unreadable.status).toBe(400);
    expect((await unreadable.json()).error.code).toBe('bad-request');
  });

  it('makes a link, sets the password there once, and the person can then sign in', async () => {
    clock = Date.now();
    const ticket = await ticketFor('nell', 'Nell Hazeldine', 72 * 3600);
    const token = must(/\/set-password\/([\w-]+)$/.exec(ticket.url)?.[1], 'a ticket in the url');
    expect(ticket.url).toBe(`${idp.url}/set-password/${token}`);
    expect(Buffer.from(token, 'base64url')).toHaveLength(32);
    expect(Date.parse(ticket.expiresAt)).toBe(clock + 72 * 3600 * 1000);
    expect(ticket.accountExists).toBe(false);
    const hashes = await storedTicketHashes();
    expect(hashes).toContain(createHash('sha256').update(token).digest('hex'));
    expect(hashes).not.toContain(token);

    const page = await fetch(ticket.url);
    expect(page.status).toBe(200);
    expect(page.headers.get('referrer-policy')).toBe('no-referrer');
    const html = await page.text();
    expect(html).toContain('Latchwork');
    expect(html).toContain(`value="${email('nell')}"`);
    expect(html).toMatch(/<label for="password">New password<\/label>/);
    expect(html).toMatch(/<label for="repeat">Repeat the new password<\/label>/);
    expect(html).toMatch(/aria-describedby="password-hint"/);
    expect(html).toContain('At least 12 characters');
    expect(foreignUrls(html, idp.url)).toEqual([]);

    const short = await submit(ticket.url, 'eleven-char');
    expect(short.status).toBe(400);
    const shortHtml = await short.text();
    expect(shortHtml).toMatch(
      /<p class="field-error" id="password-error">Use at least 12 characters\.<\/p>/,
    );
    expect(shortHtml).toMatch(
      /id="password"[^>]*aria-describedby="password-hint password-error"[^>]*aria-invalid="true"/,
    );
    const mismatch = await submit(ticket.url, 'floor-plank-lantern-9', 'floor-plank-lantern-8');
    expect(mismatch.status).toBe(400);
    expect(await mismatch.text()).toMatch(/id="repeat-error">The two passwords are not the same\./);
    expect((await submit(ticket.url, 'x'.repeat(129))).status).toBe(400);

    const done = await submit(ticket.url, 'floor-plank-lantern-9');
    expect(done.status).toBe(303);
    expect(done.headers.get('location')).toBe(RETURN_TO);

    const tokens = await new Browser(idp, discovery).signIn(email('nell'), 'floor-plank-lantern-9');
    const userinfo = await fetch(discovery.userinfo_endpoint, {
      headers: { authorization: `Bearer ${must(tokens['access_token'], 'an access token')}` },
    });
    expect(await userinfo.json()).toMatchObject({ email: email('nell'), name: 'Nell Hazeldine' });

    // used once: the link is gone, for the page and for another submission
    const again = await fetch(ticket.url);
    expect(again.status).toBe(410);
    expect(await again.text()).toContain(GONE.replace("'", '&#39;'));
    expect((await submit(ticket.url, 'another-password-77')).status).toBe(410);
  });

  it('lets only one of two racing submissions of the same link through', async () => {
    const ticket = await ticketFor('race');
    const results = await Promise.all([
      submit(ticket.url, 'first-racer-password'),
      submit(ticket.url, 'second-racer-password'),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([303, 410]);
  });

  it('refuses a link once it has expired', async () => {
    clock = Date.now();
    const ticket = await ticketFor('late', '', 60);
    clock += 59_000;
    expect((await fetch(ticket.url)).status).toBe(200);
    clock += 2_000;
    const page = await fetch(ticket.url);
    expect(page.status).toBe(410);
    expect(await page.text()).toContain('This link has expired or has already been used.');
    expect((await submit(ticket.url, 'too-late-password-1')).status).toBe(410);
    clock = Date.now();
  });

  it('answers 410 for a link that never existed', async () => {
    expect((await fetch(`${idp.url}/set-password/${'A'.repeat(43)}`)).status).toBe(410);
    expect((await fetch(`${idp.url}/set-password/short`)).status).toBe(410);
  });

  it('says when the e-mail already has a password, and keeps that account on reset', async () => {
    const existing = await setPassword(email('kept'), 'the-old-password-1', 'Kit Keeper', {
      databaseUrl,
      dataDir: data.dir,
    });
    const ticket = await ticketFor('kept', 'Typed By Inviter');
    expect(ticket.accountExists).toBe(true);
    expect((await submit(ticket.url, 'the-new-password-2')).status).toBe(303);
    const tokens = await new Browser(idp, discovery).signIn(email('kept'), 'the-new-password-2');
    const [, payload = ''] = must(tokens['id_token'], 'an ID token').split('.');
    expect(JSON.parse(Buffer.from(payload, 'base64url').toString()).sub).toBe(existing.id);
  });
});
