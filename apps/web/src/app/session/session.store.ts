import { HttpClient, HttpErrorResponse, HttpStatusCode } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { BROWSER_LOCATION } from './browser-location';
import { signInHref } from './sign-in-link';

/** The body of `GET /api/v1/me` and `PUT /api/v1/me/active-tenant`. */
export interface Me {
  readonly user: { readonly id: string; readonly email: string; readonly name: string };
  readonly memberships: readonly Membership[];
  readonly activeTenant: {
    readonly id: string;
    readonly name: string;
    readonly role: string;
    readonly currency: string;
    readonly units: string;
  };
  readonly permissions: readonly string[];
}

/** One firm the person belongs to, with their role there. */
export interface Membership {
  readonly tenantId: string;
  readonly tenantName: string;
  readonly role: string;
}

/**
 * Why the app shows the signed-out state: never signed in (or signed out on purpose), or a
 * session that ended while the app believed it was signed in (the server forgot it or it expired).
 */
export type SignedOutReason = 'signed-out' | 'session-ended';

/**
 * Who is signed in, in which firm, and what their role may do. Loaded once from `/me` at
 * start-up; everything that shows or hides by permission reads these signals.
 */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly http = inject(HttpClient);
  private readonly location = inject(BROWSER_LOCATION);

  private readonly current = signal<Me | null>(null);
  private readonly reason = signal<SignedOutReason>('signed-out');
  private readonly endedAt = signal<string | null>(null);

  /** The signed-in person's profile, firms and permissions; null when signed out. */
  readonly me = this.current.asReadonly();
  readonly signedIn = computed(() => this.current() !== null);
  readonly user = computed(() => this.current()?.user ?? null);
  readonly activeTenant = computed(() => this.current()?.activeTenant ?? null);
  readonly memberships = computed(() => this.current()?.memberships ?? []);
  /** Why the app is signed out, so the landing page can say so. */
  readonly signedOutReason = this.reason.asReadonly();
  /** Where the person was when their session ended: their Sign in link returns there. */
  readonly returnTo = this.endedAt.asReadonly();

  private readonly granted = computed(() => new Set(this.current()?.permissions ?? []));

  /** True when the signed-in person's role in the active firm holds `permission`. */
  can(permission: string): boolean {
    return this.granted().has(permission);
  }

  /**
   * Asks the API who is signed in. A 401 is the ordinary signed-out answer; any other failure
   * (API down) also leaves the app signed out, and the status page tells the rest.
   */
  async load(): Promise<void> {
    try {
      this.signIn(await firstValueFrom(this.http.get<Me>('/api/v1/me')));
    } catch (err: unknown) {
      if (!(err instanceof HttpErrorResponse)) throw err;
      this.current.set(null);
    }
  }

  /** Makes another of the person's firms the active one; the answer carries the new role. */
  async switchTenant(tenantId: string): Promise<void> {
    const me = await firstValueFrom(this.http.put<Me>('/api/v1/me/active-tenant', { tenantId }));
    this.signIn(me);
  }

  /**
   * Ends the session at the API, then sends the browser to the identity provider's sign-out
   * page (which comes back to the app), so the next person at this computer starts afresh.
   */
  async signOut(): Promise<void> {
    const answer = await firstValueFrom(
      this.http.post<{ signOutUrl: string | null }>('/api/v1/auth/logout', {}),
    ).catch((err: unknown) => {
      // Already signed out at the server: nothing to end there.
      if (err instanceof HttpErrorResponse && err.status === HttpStatusCode.Unauthorized) {
        return { signOutUrl: null };
      }
      throw err;
    });
    this.current.set(null);
    this.reason.set('signed-out');
    this.location.assign(answer.signOutUrl ?? '/');
  }

  /**
   * The API answered 401 although the app believed it was signed in: forget the person and
   * remember where they were, so that signing in again brings them back there.
   */
  expire(where: string): void {
    if (!this.signedIn()) return;
    this.current.set(null);
    this.reason.set('session-ended');
    this.endedAt.set(where);
  }

  /** The Sign in link for the signed-out state: back to where the session ended, if it did. */
  signInLink(fallback: string): string {
    return signInHref(this.endedAt() ?? fallback);
  }

  private signIn(me: Me): void {
    this.current.set(me);
    this.reason.set('signed-out');
    this.endedAt.set(null);
  }
}
