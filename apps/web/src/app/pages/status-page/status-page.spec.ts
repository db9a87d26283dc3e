import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { apiErrorInterceptor } from '../../shell/api-error-interceptor';
import { StatusPage } from './status-page';

describe('StatusPage', () => {
  let backend: HttpTestingController;
  const snackBar = { open: vi.fn() };

  beforeEach(() => {
    snackBar.open.mockClear();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([apiErrorInterceptor])),
        provideHttpClientTesting(),
        { provide: MatSnackBar, useValue: snackBar },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  async function render() {
    const fixture = TestBed.createComponent(StatusPage);
    await fixture.whenStable();
    return fixture;
  }

  function text(fixture: { nativeElement: HTMLElement }): string {
    return (fixture.nativeElement.textContent ?? '').replace(/\s+/g, ' ');
  }

  it('shows each dependency with its state and latency', async () => {
    const fixture = await render();
    backend.expectOne('/api/v1/health').flush({
      status: 'degraded',
      checks: {
        postgres: { status: 'up', latencyMs: 4 },
        mail: { status: 'down', latencyMs: null, error: 'SMTP greeting timed out' },
      },
    });
    await fixture.whenStable();

    const rows = [...fixture.nativeElement.querySelectorAll('tbody tr')].map((row) =>
      [...row.querySelectorAll('th, td')].map((cell) =>
        (cell.textContent ?? '').replace(/\s+/g, ' ').trim(),
      ),
    );
    expect(rows).toEqual([
      ['Database (PostgreSQL)', 'check_circle Up', '4 ms'],
      ['Outgoing mail SMTP greeting timed out', 'error Down', 'no answer'],
    ]);
    expect(text(fixture)).toContain('Something is down');
  });

  it('explains an unreachable API without a second, global error message, and retries', async () => {
    const fixture = await render();
    backend.expectOne('/api/v1/health').error(new ProgressEvent('error'));
    await fixture.whenStable();

    const alert: HTMLElement = fixture.nativeElement.querySelector('[role="alert"]');
    expect(alert.textContent).toContain('No answer from the Latchwork API');
    expect(alert.textContent).toContain('Could not reach Latchwork');
    expect(snackBar.open).not.toHaveBeenCalled();

    const retry: HTMLButtonElement = fixture.nativeElement.querySelector('button');
    retry.click();
    await fixture.whenStable();
    expect(retry.textContent).toContain('Checking');
    expect(retry.disabled).toBe(true);

    backend.expectOne('/api/v1/health').flush({ status: 'up', checks: {} });
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[role="alert"]')).toBeNull();
    expect(text(fixture)).toContain('Everything is up.');
    expect(retry.disabled).toBe(false);
  });
});
