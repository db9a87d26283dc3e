// What the stack tests share: the stack's settings (set by tests/run-all.mjs from
// docker-free-dev/lib/config.mjs) and the mail fake's inbox, read through its JSON API.

/** A setting of the running test stack; fails clearly when a test is run outside npm test. */
export function stackEnv(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set; run through npm test`);
  return value;
}

export interface InboxMessage {
  subject: string;
  text: string;
}

/** The e-mails the mail fake holds for `to`, newest first. */
export async function messagesTo(to: string): Promise<InboxMessage[]> {
  const res = await fetch(`${stackEnv('MAIL_UI_URL')}/api/messages?to=${encodeURIComponent(to)}`);
  const body = await res.json();
  return Array.isArray(body) ? body : body.messages;
}

/** Waits until the mail fake holds at least one e-mail for `to` (the worker sends it). */
export async function waitForMessagesTo(to: string, timeoutMs = 15_000): Promise<InboxMessage[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const list = await messagesTo(to);
    if (list.length) return list;
    if (Date.now() > deadline) throw new Error(`no e-mail reached ${to} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}
