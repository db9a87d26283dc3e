import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import { of } from 'rxjs';
import { Member } from '../../api/members-api';
import { meOf } from '../../session/me-fixture';
import { Session } from '../../session/session.store';
import { apiErrorInterceptor } from '../../shell/api-error-interceptor';
import { TeamPage } from './team-page';

const LAST_OWNER = 'A firm needs at least one owner: make someone else an owner first.';

const OWNER: Member = {
  userId: '6f1c1d2e-0000-4000-8000-000000000001',
  email: 'owner@kestrel-floorworks.test',
  name: 'Rosalind Achterberg',
  role: 'owner',
  invitedAt: '2026-11-01T09:00:00.000Z',
  joinedAt: '2026-11-01T09:30:00.000Z',
};
const CREW: Member = {
  userId: '6f1c1d2e-0000-4000-8000-000000000005',
  email: 'crew@kestrel-floorworks.test',
  name: 'Tomasz Quill',
  role: 'installer',
  invitedAt: '2026-11-02T09:00:00.000Z',
  joinedAt: null,
};

describe('TeamPage', () => {
  let backend: HttpTestingController;
  let fixture: ComponentFixture<TeamPage>;
  const snackBar = { open: vi.fn() };
  const dialog = { open: vi.fn() };

  beforeEach(async () => {
    snackBar.open.mockClear();
    dialog.open.mockReset();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([apiErrorInterceptor])),
        provideHttpClientTesting(),
        { provide: MatSnackBar, useValue: snackBar },
        { provide: MatDialog, useValue: dialog },
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    const session = TestBed.inject(Session);
    const loaded = session.load();
    backend.expectOne('/api/v1/me').flush(meOf('owner', ['members:read', 'members:write']));
    await loaded;

    fixture = TestBed.createComponent(TeamPage);
    backend.expectOne('/api/v1/members').flush([OWNER, CREW]);
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  /** Lets the page's async handlers finish and the view catch up. */
  async function settle(): Promise<void> {
    for (let turn = 0; turn < 3; turn++) {
      await new Promise((resolve) => setTimeout(resolve));
      await fixture.whenStable();
    }
  }

  const el = () => fixture.nativeElement as HTMLElement;
  const alertText = () => el().querySelector('[role="alert"] span')?.textContent?.trim() ?? null;
  const roleShown = (row: number) => {
    const rows = el().querySelectorAll('tbody tr');
    return rows.item(row)?.querySelector('.mat-mdc-select-value')?.textContent?.trim();
  };

  /** Picks a role in a row's select, as a person would with the mouse. */
  async function pickRole(row: number, label: string): Promise<void> {
    el().querySelectorAll<HTMLElement>('tbody tr .mat-mdc-select-trigger')[row].click();
    await settle();
    const option = [...document.querySelectorAll<HTMLElement>('mat-option')].find(
      (o) => o.textContent?.trim() === label,
    );
    option?.click();
    await settle();
  }

  it('lists each member with their role, and who has only been invited', () => {
    const rows = [...el().querySelectorAll('tbody tr')].map((r) =>
      r.textContent?.replace(/\s+/g, ' '),
    );
    expect(rows[0]).toContain('Rosalind Achterberg');
    expect(roleShown(0)).toBe('Owner');
    expect(rows[1]).toContain('Invited');
    expect(rows[1]).toContain('Resend invitation');
  });

  it('shows the last-owner refusal clearly, once, and puts the role back', async () => {
    await pickRole(0, 'Estimator');
    const req = backend.expectOne(`/api/v1/members/${OWNER.userId}`);
    expect(req.request.method).toBe('PATCH');
    expect(req.request.body).toEqual({ role: 'estimator' });
    req.flush(
      { error: { code: 'conflict', message: LAST_OWNER } },
      { status: 409, statusText: 'Conflict' },
    );
    await settle();

    expect(alertText()).toBe(LAST_OWNER);
    expect(roleShown(0)).toBe('Owner');
    // Shown on the page only: a second copy in a snackbar would just repeat it.
    expect(snackBar.open).not.toHaveBeenCalled();
  });

  it('shows the same refusal when removing the last owner, after the confirmation', async () => {
    dialog.open.mockReturnValue({ afterClosed: () => of(true) });
    el()
      .querySelector<HTMLButtonElement>('button[aria-label="Remove Rosalind Achterberg"]')
      ?.click();
    await settle();
    const req = backend.expectOne(`/api/v1/members/${OWNER.userId}`);
    expect(req.request.method).toBe('DELETE');
    req.flush(
      { error: { code: 'conflict', message: LAST_OWNER } },
      { status: 409, statusText: 'Conflict' },
    );
    await settle();

    expect(alertText()).toBe(LAST_OWNER);
    expect(el().querySelectorAll('tbody tr')).toHaveLength(2);
  });

  it('removes nobody when the confirmation is cancelled', async () => {
    dialog.open.mockReturnValue({ afterClosed: () => of(false) });
    el().querySelector<HTMLButtonElement>('button[aria-label="Remove Tomasz Quill"]')?.click();
    await fixture.whenStable();
    backend.expectNone(`/api/v1/members/${CREW.userId}`);
    expect(el().querySelectorAll('tbody tr')).toHaveLength(2);
  });

  it('keeps a role change the API accepts', async () => {
    await pickRole(1, 'Stores');
    backend.expectOne(`/api/v1/members/${CREW.userId}`).flush({ ...CREW, role: 'stores' });
    await settle();
    expect(roleShown(1)).toBe('Stores');
    expect(alertText()).toBeNull();
  });

  it('puts the API’s field problems under the invitation fields', async () => {
    const input = (name: string) =>
      el().querySelector<HTMLInputElement>(`input[formcontrolname="${name}"]`) as HTMLInputElement;
    input('email').value = 'new@kestrel-floorworks.test';
    input('email').dispatchEvent(new Event('input'));
    input('name').value = 'New Person';
    input('name').dispatchEvent(new Event('input'));
    el().querySelector<HTMLButtonElement>('.invite__send')?.click();
    await settle();
    backend.expectOne('/api/v1/members/invitations').flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Invalid body',
          details: { problems: [{ path: 'email', message: 'Invalid email address' }] },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await settle();
    expect(el().querySelector('mat-error')?.textContent?.trim()).toBe('Invalid email address');
  });
});
