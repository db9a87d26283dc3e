import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Role } from '@latchwork/shared-access';
import { Observable } from 'rxjs';
import { SHOW_ERROR_SNACKBAR } from '../shell/api-error-interceptor';

/** One person of the firm, as `GET /api/v1/members` lists them. */
export interface Member {
  readonly userId: string;
  readonly email: string;
  readonly name: string;
  readonly role: Role;
  /** ISO date-time. */
  readonly invitedAt: string;
  /** ISO date-time; null until the person first signs in. */
  readonly joinedAt: string | null;
}

/** The body of an invitation. */
export interface Invitation {
  readonly email: string;
  readonly name: string;
  readonly role: Role;
}

/**
 * The members endpoints. Changes are sent without the global error snackbar: the team page
 * shows their refusals (last owner, already a member) beside what the person did.
 */
@Injectable({ providedIn: 'root' })
export class MembersApi {
  private readonly http = inject(HttpClient);
  private readonly quiet = { context: new HttpContext().set(SHOW_ERROR_SNACKBAR, false) };

  list(): Observable<Member[]> {
    return this.http.get<Member[]>('/api/v1/members');
  }

  invite(invitation: Invitation): Observable<Member> {
    return this.http.post<Member>('/api/v1/members/invitations', invitation, this.quiet);
  }

  resendInvitation(userId: string): Observable<unknown> {
    return this.http.post(
      `/api/v1/members/${encodeURIComponent(userId)}/invitation`,
      {},
      this.quiet,
    );
  }

  changeRole(userId: string, role: Role): Observable<Member> {
    return this.http.patch<Member>(
      `/api/v1/members/${encodeURIComponent(userId)}`,
      { role },
      this.quiet,
    );
  }

  remove(userId: string): Observable<unknown> {
    return this.http.delete(`/api/v1/members/${encodeURIComponent(userId)}`, this.quiet);
  }
}
