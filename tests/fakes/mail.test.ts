// The mail fake: messages sent with the real nodemailer are kept and read back through the
// JSON API; the inbox page is served from the fake itself.
import nodemailer from 'nodemailer';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { start } from '../../docker-free-dev/mail/server.mjs';
import { foreignUrls, must, tempDataDir } from './support';

type Mail = Awaited<ReturnType<typeof start>>;
interface Message {
  id: string;
  receivedAt: string;
  date: string | null;
  from: { address: string; name: string } | null;
  to: { address: string; name: string }[];
  cc: { address: string; name: string }[];
  bcc: { address: string; name: string }[];
  envelope: { from: string | null; to: string[] };
  subject: string;
  text: string | null;
  html: string | null;
  attachments: { filename: string | null; contentType: string; size: number }[];
}

let data: Awaited<ReturnType<typeof tempDataDir>>;
let mail: Mail;

function transport(withLogin: boolean) {
  return nodemailer.createTransport({
    host: '127.0.0.1',
    port: mail.smtpPort,
    secure: false,
    ...(withLogin ? { auth: { user: 'latchwork', pass: 'anything' } } : {}),
  });
}

async function messages(query = ''): Promise<Message[]> {
  const response = await fetch(`${mail.url}/api/messages${query}`);
  expect(response.status).toBe(200);
  return (await response.json()) as Message[];
}

beforeAll(async () => {
  data = await tempDataDir('mail');
  mail = await start({ smtpPort: 0, uiPort: 0, dataDir: data.dir });
});

afterAll(async () => {
  await mail?.close();
  await data?.remove();
});

describe('mail fake', () => {
  it('answers its health check', async () => {
    expect(mail.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
    expect((await fetch(`${mail.url}/health`)).status).toBe(200);
  });

  it('keeps a message sent with a login, with all its parts', async () => {
    const sender = transport(true);
    const info = await sender.sendMail({
      from: '"Harbour Floors" <office@harbourfloors.test>',
      to: '"Dana Quill" <dana@quillgarages.test>',
      cc: 'books@harbourfloors.test',
      bcc: 'archive@harbourfloors.test',
      subject: 'Your quote Q-2031 for the garage floor',
      text: 'Please find your quote attached.',
      html: '<p>Please find your <strong>quote</strong> attached.</p>',
      attachments: [
        {
          filename: 'Q-2031.pdf',
          content: Buffer.from('%PDF-1.7 fake'),
          contentType: 'application/pdf',
        },
      ],
    });
    sender.close();
    expect(info.accepted).toHaveLength(3);

    const message = must((await messages())[0], 'a kept message');
    expect(message).toMatchObject({
      from: { address: 'office@harbourfloors.test', name: 'Harbour Floors' },
      to: [{ address: 'dana@quillgarages.test', name: 'Dana Quill' }],
      cc: [{ address: 'books@harbourfloors.test', name: '' }],
      bcc: [{ address: 'archive@harbourfloors.test', name: '' }],
      subject: 'Your quote Q-2031 for the garage floor',
      text: 'Please find your quote attached.',
      html: '<p>Please find your <strong>quote</strong> attached.</p>',
      attachments: [{ filename: 'Q-2031.pdf', contentType: 'application/pdf', size: 13 }],
    });
    expect(message.envelope.to).toEqual([
      'dana@quillgarages.test',
      'books@harbourfloors.test',
      'archive@harbourfloors.test',
    ]);
    expect(message.id).toBeTruthy();
    expect(Number.isNaN(Date.parse(must(message.date, 'a Date header')))).toBe(false);

    const one = await fetch(`${mail.url}/api/messages/${message.id}`);
    expect(one.status).toBe(200);
    expect(await one.json()).toEqual(message);
  });

  it('accepts a message without a login and lists newest first', async () => {
    const sender = transport(false);
    await sender.sendMail({
      from: 'noreply@harbourfloors.test',
      to: 'crew@harbourfloors.test',
      subject: 'Job sheet J-1001 is ready',
      text: 'Fitting on Tuesday.',
    });
    sender.close();
    const all = await messages();
    expect(all.map((m) => m.subject)).toEqual([
      'Job sheet J-1001 is ready',
      'Your quote Q-2031 for the garage floor',
    ]);
  });

  it('filters by recipient, including Cc and Bcc, case-insensitively', async () => {
    expect((await messages('?to=CREW@harbourfloors.test')).map((m) => m.subject)).toEqual([
      'Job sheet J-1001 is ready',
    ]);
    expect(await messages('?to=books@harbourfloors.test')).toHaveLength(1);
    expect(await messages('?to=archive@harbourfloors.test')).toHaveLength(1);
    expect(await messages('?to=nobody@harbourfloors.test')).toEqual([]);
  });

  it('serves the HTML body for a sandboxed frame, and 404 for an unknown id', async () => {
    const [latest, quote] = (await messages()).map((m) => m.id);
    const html = await fetch(`${mail.url}/api/messages/${must(quote, 'the quote')}/html`);
    expect(html.status).toBe(200);
    expect(html.headers.get('content-security-policy')).toMatch(/^sandbox;/);
    expect(await html.text()).toContain('<strong>quote</strong>');
    expect(
      (await fetch(`${mail.url}/api/messages/${must(latest, 'the latest message')}/raw`)).status,
    ).toBe(200);
    expect((await fetch(`${mail.url}/api/messages/nope-123`)).status).toBe(404);
  });

  it('serves an inbox page of its own with nothing from another host', async () => {
    const page = await fetch(`${mail.url}/`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Latchwork');
    expect(html).toContain('sandbox=""');
    expect(foreignUrls(html, mail.url)).toEqual([]);
    for (const asset of ['/assets/inbox.js', '/assets/inbox.css']) {
      const response = await fetch(`${mail.url}${asset}`);
      expect(response.status).toBe(200);
      expect(foreignUrls(await response.text(), mail.url)).toEqual([]);
    }
  });

  it('keeps messages across a restart', async () => {
    const before = await messages();
    await mail.close();
    mail = await start({ smtpPort: 0, uiPort: 0, dataDir: data.dir });
    expect(await messages()).toEqual(before);
  });

  it('clears every message on DELETE /api/messages', async () => {
    const response = await fetch(`${mail.url}/api/messages`, { method: 'DELETE' });
    expect(response.status).toBe(200);
    expect(await response.json()).toEqual({ deleted: 2 });
    expect(await messages()).toEqual([]);
  });
});
