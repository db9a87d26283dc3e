// Sign-in attempt limits of the identity-provider fake (10 failures a minute per account and per
// client address), and the signed sign-in events it streams to the app. Each test posts from its
// own loopback address so the per-address and per-account limits can be told apart.
import { createHmac, timingSafeEqual } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { setPassword } from '../../docker-free-dev/identity-provider/accounts.mjs';
import { Browser, type Discovery, FAILED, type Idp, startIdp } from './identity-provider-support';
import { tempDataDir } from './support';

const ALICE = 'alice@kestrelfloors.test';
const BOB = 'bob@kestrelfloors.test';
const CAROL = 'carol@kestrelfloors.test';
const PASSWORD = 'grout-and-gravel-7';
const EVENT_SECRET = 'test-event-secret';
const LOCKED = /Too many attempts\. Try again in (\d+) s\./;

interface Received {
  raw: Buffer;
  signature: string | undefined;
  event: { type: string; email: string; ipAddress: string | null; at: string };
}

let data: Awaited<ReturnType<typeof tempDataDir>>;
let idp: Idp;
let discovery: Discovery;
let receiver: http.Server;
const received: Received[] = [];
/** Requests the receiver holds unanswered until released (to show nothing waits for them). */
let holdResponses = false;
const held: http.ServerResponse[] = [];

beforeAll(async () => {
  data = await tempDataDir('idp-limits');
  await setPassword(ALICE, PASSWORD, 'Alice Ash', { dataDir: data.dir });
  await setPassword(BOB, PASSWORD, 'Bob Birch', { dataDir: data.dir });
  await setPassword(CAROL, PASSWORD, 'Carol Cedar', { dataDir: data.dir });
  receiver = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      const raw = Buffer.concat(chunks);
      const signature = req.headers['x-idp-signature'];
      received.push({ raw, signature: signature as string, event: JSON.parse(raw.toString()) });
      if (holdResponses) held.push(res);
      else res.writeHead(202).end();
    });
  });
  await new Promise<void>((resolve) => receiver.listen(0, '127.0.0.1', resolve));
  const { port } = receiver.address() as AddressInfo;
  ({ idp, discovery } = await startIdp({
    dataDir: data.dir,
    eventUrl: `http://127.0.0.1:${port}/api/v1/auth/provider-events`,
    eventSecret: EVENT_SECRET,
  }));
});

afterAll(async () => {
  await idp?.close();
  await new Promise((resolve) => receiver?.close(resolve));
  await data?.remove();
});

/** Opens a sign-in page and returns a function that posts it from `address`. */
async function signInFrom(address: string) {
  const browser = new Browser(idp, discovery);
  const { action } = await browser.openSignInPage();
  return (email: string, password: string) =>
    browser.postSignInFrom(address, action, { email, password });
}

/** The wait the locked page announces, checked against its Retry-After header. */
function lockedSeconds(page: { status: number; headers: http.IncomingHttpHeaders; text: string }) {
  expect(page.status).toBe(429);
  const shown = Number(LOCKED.exec(page.text)?.[1]);
  expect(shown).toBeGreaterThanOrEqual(1);
  expect(shown).toBeLessThanOrEqual(60);
  expect(page.headers['retry-after']).toBe(String(shown));
  expect(page.text).toMatch(/role="alert"/);
  return shown;
}

const eventsFor = (email: string, address: string) =>
  received.filter((r) => r.event.email === email && r.event.ipAddress === address);

describe('sign-in attempt limits', () => {
  it('locks an account after 10 failures a minute, from any address', async () => {
    const post = await signInFrom('127.0.0.2');
    for (let attempt = 1; attempt <= 9; attempt++) {
      const page = await post(ALICE, `wrong-password-${attempt}`);
      expect(page.status).toBe(401);
      expect(page.text).toContain(FAILED);
    }
    lockedSeconds(await post(ALICE, 'wrong-password-10'));

    // the right password from a fresh address is refused too: the account is locked …
    const elsewhere = await signInFrom('127.0.0.3');
    lockedSeconds(await elsewhere(ALICE, PASSWORD));
    // … and that address is not: another account signs in from it
    expect((await elsewhere(BOB, PASSWORD)).status).toBe(303);

    await vi.waitFor(() => expect(eventsFor(ALICE, '127.0.0.2')).toHaveLength(11));
    const types = eventsFor(ALICE, '127.0.0.2').map((r) => r.event.type);
    expect(types.filter((t) => t === 'sign-in-failed')).toHaveLength(10);
    expect(types.filter((t) => t === 'sign-in-locked')).toHaveLength(1);
  });

  it('locks an address after 10 failures a minute, whatever the e-mails', async () => {
    const post = await signInFrom('127.0.0.4');
    for (let attempt = 1; attempt <= 9; attempt++) {
      const page = await post(`nobody-${attempt}@kestrelfloors.test`, PASSWORD);
      expect(page.status).toBe(401);
      expect(page.text).toContain(FAILED);
    }
    const tenth = lockedSeconds(await post('nobody-10@kestrelfloors.test', PASSWORD));
    // a correct password from the locked address is refused without being checked
    const refused = await post(BOB, PASSWORD);
    expect(lockedSeconds(refused)).toBeLessThanOrEqual(tenth);
    // the same account from another address is fine: it was the address that was locked
    expect((await (await signInFrom('127.0.0.5'))(BOB, PASSWORD)).status).toBe(303);
  });
});

describe('sign-in events streamed to the app', () => {
  it('posts a signed event for a failed sign-in without holding up the page', async () => {
    holdResponses = true;
    const post = await signInFrom('127.0.0.6');
    const page = await post(CAROL.toUpperCase(), 'not-carols-password');
    expect(page.status).toBe(401);
    // the page came back although the receiver has not answered (it may not even have the
    // event yet); the event arrives on its own
    await vi.waitFor(() => expect(eventsFor(CAROL, '127.0.0.6')).toHaveLength(1));
    const [delivery] = eventsFor(CAROL, '127.0.0.6');
    expect(held.length).toBeGreaterThan(0);
    holdResponses = false;
    for (const res of held.splice(0)) res.writeHead(202).end();

    expect(delivery?.event).toEqual({
      type: 'sign-in-failed',
      email: CAROL,
      ipAddress: '127.0.0.6',
      at: expect.stringMatching(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/),
    });
    // HMAC-SHA256 (RFC 2104) of the exact bytes received, keyed with the shared secret
    const expected = `sha256=${createHmac('sha256', EVENT_SECRET)
      .update(delivery?.raw ?? '')
      .digest('hex')}`;
    const given = Buffer.from(delivery?.signature ?? '');
    expect(given.length).toBe(expected.length);
    expect(timingSafeEqual(given, Buffer.from(expected))).toBe(true);
    const otherKey = createHmac('sha256', 'another-secret').update(delivery?.raw ?? '');
    expect(delivery?.signature).not.toBe(`sha256=${otherKey.digest('hex')}`);
  });

  it('reports an unknown e-mail the same way, and nothing for a successful sign-in', async () => {
    expect((await (await signInFrom('127.0.0.7'))(BOB, PASSWORD)).status).toBe(303);
    const post = await signInFrom('127.0.0.7');
    expect((await post('stranger@elsewhere.test', PASSWORD)).status).toBe(401);
    await vi.waitFor(() =>
      expect(eventsFor('stranger@elsewhere.test', '127.0.0.7')).toHaveLength(1),
    );
    expect(eventsFor('stranger@elsewhere.test', '127.0.0.7')[0]?.event.type).toBe('sign-in-failed');
    expect(eventsFor(BOB, '127.0.0.7')).toHaveLength(0);
  });
});
