import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { meOf } from '../session/me-fixture';
import { Session } from '../session/session.store';
import { JobPage } from './job-page';
import type { JobHeader } from './jobs-api';

const JOB: JobHeader = {
  id: 'j1',
  reference: 'J-00042',
  title: 'Workshop floor',
  stage: 'survey_booked',
  heldFrom: null,
  nextStages: ['surveyed', 'on_hold', 'cancelled'],
  stageChangedAt: '2026-01-05T10:00:00Z',
  lostReason: null,
  valueEstimateMinor: 485_000,
  source: '',
  customer: { id: 'c1', name: 'Greyling Motors' },
  site: null,
  owner: null,
  enquiryOn: '2026-01-05',
  surveyAt: null,
  quoteDueOn: null,
  installStartOn: null,
  installEndOn: null,
};

// The Survey and Files tabs are lazy (`matTabContent`): their panels must fill when chosen.
describe('JobPage tabs', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'jobs/:jobId', component: JobPage }]),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    const loaded = TestBed.inject(Session).load();
    backend.expectOne('/api/v1/me').flush(meOf('estimator', ['jobs:read', 'jobs:write']));
    await loaded;
    harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/jobs/j1', JobPage);
    backend.expectOne('/api/v1/jobs/j1').flush(JOB);
    await settle();
    backend.expectOne('/api/v1/jobs/j1/stage-history').flush([]);
    await settle();
  });

  async function settle(): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve, 0));
    await harness.fixture.whenStable();
  }

  const root = () => harness.routeNativeElement as HTMLElement;
  const tab = (name: string) =>
    [...root().querySelectorAll<HTMLElement>('[role="tab"]')].find(
      (t) => t.textContent?.trim() === name,
    );
  const activePanel = () => root().querySelector('[role="tabpanel"][aria-hidden="false"]');

  it('shows the survey when the Survey tab is chosen', async () => {
    tab('Survey')?.click();
    await settle();
    expect(activePanel()?.querySelector('lw-job-survey')).not.toBeNull();
  });

  it('shows the files when the Files tab is chosen', async () => {
    tab('Files')?.click();
    await settle();
    expect(activePanel()?.querySelector('lw-file-panel')).not.toBeNull();
  });
});
