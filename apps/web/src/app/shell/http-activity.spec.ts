import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { HttpActivity, httpActivityInterceptor } from './http-activity';

describe('HttpActivity with its interceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let activity: HttpActivity;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([httpActivityInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
    activity = TestBed.inject(HttpActivity);
  });

  afterEach(() => backend.verify());

  it('starts idle', () => {
    expect(activity.inFlight()).toBe(0);
    expect(activity.busy()).toBe(false);
  });

  it('counts overlapping requests until each one is answered or fails', () => {
    http.get('/api/v1/a').subscribe();
    http.get('/api/v1/b').subscribe({ error: () => undefined });
    http.get('/api/v1/c').subscribe({ error: () => undefined });
    expect(activity.inFlight()).toBe(3);
    expect(activity.busy()).toBe(true);

    backend.expectOne('/api/v1/a').flush({ ok: true });
    expect(activity.inFlight()).toBe(2);

    backend.expectOne('/api/v1/b').flush(null, { status: 500, statusText: 'Server Error' });
    expect(activity.inFlight()).toBe(1);

    backend.expectOne('/api/v1/c').error(new ProgressEvent('error'));
    expect(activity.inFlight()).toBe(0);
    expect(activity.busy()).toBe(false);
  });

  it('stops counting a request that is cancelled', () => {
    const subscription = http.get('/api/v1/slow').subscribe();
    const request = backend.expectOne('/api/v1/slow');
    expect(activity.inFlight()).toBe(1);

    subscription.unsubscribe();
    expect(request.cancelled).toBe(true);
    expect(activity.inFlight()).toBe(0);
  });

  it('does not count a request before anyone subscribes to it', () => {
    const pending = http.get('/api/v1/lazy');
    expect(activity.inFlight()).toBe(0);
    pending.subscribe();
    expect(activity.inFlight()).toBe(1);
    backend.expectOne('/api/v1/lazy').flush({});
  });
});
