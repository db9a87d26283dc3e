// Small helpers shared by the fakes' tests.
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** A fresh data folder (what LW_DATA_DIR points at) and a function that removes it. */
export async function tempDataDir(name: string) {
  const dir = await mkdtemp(join(tmpdir(), `lw-fake-${name}-`));
  return { dir, remove: () => rm(dir, { recursive: true, force: true }) };
}

/** A minimal cookie jar for driving browser-style redirects with fetch. */
export class CookieJar {
  readonly cookies = new Map<string, string>();

  header(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
  }

  store(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const pair = line.split(';')[0] ?? '';
      const at = pair.indexOf('=');
      const name = pair.slice(0, at).trim();
      const value = pair.slice(at + 1);
      const expired = /expires=Thu, 01 Jan 1970/i.test(line) || /max-age=0/i.test(line);
      if (expired || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  /** fetch without following redirects, sending and keeping cookies. */
  async fetch(url: string | URL, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('cookie', this.header());
    const response = await fetch(url, { ...init, headers, redirect: 'manual' });
    this.store(response);
    return response;
  }
}

/** Absolute URLs in a page that point anywhere but `ownOrigin`: there must be none. */
export function foreignUrls(html: string, ownOrigin: string): string[] {
  return [...html.matchAll(/(?:https?:)?\/\/[^\s"'<>)]+/g)]
    .map((m) => m[0])
    .filter((url) => !url.startsWith(`${ownOrigin}/`));
}

/** The value, or a failed test naming what was missing (instead of a `!` assertion). */
export function must<T>(value: T | null | undefined, what: string): T {
  if (value === null || value === undefined) throw new Error(`expected ${what}`);
  return value;
}
