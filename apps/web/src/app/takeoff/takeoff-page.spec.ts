import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { DEFAULT_RATES } from '@latchwork/takeoff';
import { meOf } from '../session/me-fixture';
import { Session } from '../session/session.store';
import { apiErrorInterceptor } from '../shell/api-error-interceptor';
import { RECOMPUTE_DELAY_MS } from './floor-editor.store';
import { TakeoffPage } from './takeoff-page';

describe('TakeoffPage', () => {
  let backend: HttpTestingController;
  let fixture: ComponentFixture<TakeoffPage>;

  async function open(rates: 'ok' | 'fail' = 'ok'): Promise<void> {
    fixture = TestBed.createComponent(TakeoffPage);
    const req = backend.expectOne('/api/v1/takeoffs/rates');
    if (rates === 'ok')
      req.flush({ defaults: DEFAULT_RATES, overrides: {}, effective: DEFAULT_RATES });
    else
      req.flush(
        { error: { code: 'internal', message: 'down' } },
        { status: 500, statusText: 'Error' },
      );
    await settle();
  }

  beforeEach(async () => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([apiErrorInterceptor])),
        provideHttpClientTesting(),
        { provide: MatSnackBar, useValue: { open: vi.fn() } },
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    const loaded = TestBed.inject(Session).load();
    backend.expectOne('/api/v1/me').flush(meOf('estimator', ['takeoffs:read', 'takeoffs:write']));
    await loaded;
  });

  afterEach(() => backend.verify());

  /** Waits out the recompute debounce and lets the view catch up. */
  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve, RECOMPUTE_DELAY_MS + 30));
    await fixture.whenStable();
  }

  const el = () => fixture.nativeElement as HTMLElement;
  const shown = (name: string) => el().querySelector(`[data-test="${name}"]`)?.textContent?.trim();
  const button = (label: string) =>
    [...el().querySelectorAll<HTMLButtonElement>('button')].find((b) =>
      b.textContent?.includes(label),
    );
  const field = (label: string) => {
    const formField = [...el().querySelectorAll('mat-form-field')].find(
      (f) => f.querySelector('mat-label')?.textContent?.trim() === label,
    );
    return formField?.querySelector<HTMLInputElement | HTMLTextAreaElement>('input, textarea');
  };
  function type(label: string, text: string): void {
    const input = field(label);
    if (!input) throw new Error(`no field ${label}`);
    input.value = text;
    input.dispatchEvent(new Event('input'));
  }

  it('lays the worked-example garage: 6.0 × 6.5 m at 500 mm from a wall corner is 156 tiles', async () => {
    await open();
    button('Start at a wall corner')?.click();
    await settle();
    // Issue 4 §8, from memory: whole pieces per direction, 12 across × 13 along = 156.
    expect(shown('tiles-laid')).toBe('156');
  });

  it('recomputes when the rectangle changes, and remembers the floor for a reload', async () => {
    await open();
    button('Start at a wall corner')?.click();
    // The length, not the width: the example's 4.8 m doorway needs the full 6 m wall.
    type('Length (y)', '4 m');
    await settle();
    // 4000 mm less the gaps is 8 pieces along (7 whole and a 495 mm cut), 12 across: 96.
    expect(shown('tiles-laid')).toBe('96');
    const saved = Object.entries(localStorage).find(([key]) => key.startsWith('latchwork.takeoff'));
    expect(JSON.parse(saved?.[1] ?? '{}').outline).toEqual([
      [0, 0],
      [6000, 0],
      [6000, 4000],
      [0, 4000],
    ]);
  });

  it('shows a crossing outline inline, naming the point, and keeps the last plan dimmed', async () => {
    await open();
    button('Start at a wall corner')?.click();
    await settle();
    [...el().querySelectorAll<HTMLElement>('[role="tab"]')]
      .find((t) => t.textContent?.includes('Coordinates'))
      ?.click();
    await settle();
    type('Corners, one "x, y" a line', '0, 0\n4000, 0\n0, 3000\n4000, 3000');
    await settle();
    expect(el().textContent).toContain('Outline point 4 makes the walls cross');
    expect(el().querySelector('svg.svg')?.classList).toContain('svg--stale');
    expect(shown('tiles-laid')).toBe('156');
  });

  it('falls back to the standard rates, and says so, when the firm’s rates do not load', async () => {
    await open('fail');
    expect(el().textContent).toContain('this takeoff uses the standard rates');
    expect(shown('tiles-laid')).toMatch(/^\d+$/);
  });
});
