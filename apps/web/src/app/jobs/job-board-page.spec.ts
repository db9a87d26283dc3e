import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Stage } from '@latchwork/jobs-domain';
import { meOf } from '../session/me-fixture';
import { Session } from '../session/session.store';
import { JobBoardPage } from './job-board-page';
import type { Board, JobRow } from './jobs-api';

function card(id: string, stage: Stage, value: number): JobRow {
  return {
    id,
    reference: `J-0000${id}`,
    title: `Workshop floor ${id}`,
    stage,
    valueEstimateMinor: value,
    ownerUserId: null,
    ownerName: 'Dev Ramaswamy',
    customerId: 'c1',
    customerName: 'Greyling Motors',
    siteId: null,
    siteName: null,
    enquiryOn: '2026-01-05',
    stageChangedAt: '2026-01-05T10:00:00Z',
    installStartOn: null,
    heldFrom: null,
  };
}

const BOARD: Board = {
  columns: (['enquiry', 'survey_booked', 'quoted', 'lost', 'paid'] as Stage[]).map((stage) => {
    const cards =
      stage === 'enquiry'
        ? [card('1', 'enquiry', 250_000)]
        : stage === 'quoted'
          ? [card('2', 'quoted', 100_000)]
          : [];
    return {
      stage,
      label: stage,
      count: cards.length,
      valueMinor: cards.reduce((a, c) => a + (c.valueEstimateMinor ?? 0), 0),
      unvalued: 0,
      cards,
      more: false,
    };
  }),
  openPipeline: { count: 2, valueMinor: 350_000, unvalued: 0 },
  all: { count: 2, valueMinor: 350_000, unvalued: 0 },
};

describe('JobBoardPage drops', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;
  let page: JobBoardPage;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([{ path: 'jobs', component: JobBoardPage }]),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    const loaded = TestBed.inject(Session).load();
    backend.expectOne('/api/v1/me').flush(meOf('estimator', ['jobs:read', 'jobs:write']));
    await loaded;
    harness = await RouterTestingHarness.create();
    page = await harness.navigateByUrl('/jobs', JobBoardPage);
    backend.match('/api/v1/jobs/team').forEach((r) => r.flush([]));
    backend.expectOne((r) => r.url === '/api/v1/jobs/board').flush(BOARD);
    await settle();
  });

  afterEach(() => {
    backend.verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((e) => (e.innerHTML = ''));
  });

  async function settle(ms = 0): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve, ms));
    await harness.fixture.whenStable();
  }
  const column = (stage: string) =>
    [...(harness.routeNativeElement as HTMLElement).querySelectorAll('.column')].find((c) =>
      c.getAttribute('aria-label')?.startsWith(`${stage},`),
    );
  const cardsIn = (stage: string) =>
    [...(column(stage)?.querySelectorAll('.card__ref') ?? [])].map((a) => a.textContent?.trim());
  const snack = () => document.querySelector('.mat-mdc-snack-bar-label')?.textContent?.trim() ?? '';

  it('shows each column with its count and value', () => {
    expect(column('enquiry')?.textContent).toContain('£2,500.00');
    expect(cardsIn('enquiry')).toEqual(['J-00001']);
  });

  it('snaps a refused drop back with the reason, sending nothing', async () => {
    await page.moveCard(card('1', 'enquiry', 250_000), 'paid');
    await settle();
    backend.expectNone((r) => r.url.includes('/moves'));
    expect(cardsIn('enquiry')).toEqual(['J-00001']);
    expect(snack()).toContain("can't go from “Enquiry” to “Paid”");
  });

  it('moves the card at once and sends the move', async () => {
    const done = page.moveCard(card('1', 'enquiry', 250_000), 'survey_booked');
    await settle();
    expect(cardsIn('survey_booked')).toEqual(['J-00001']);
    expect(column('survey_booked')?.textContent).toContain('£2,500.00');
    const req = backend.expectOne('/api/v1/jobs/1/moves');
    expect(req.request.body).toEqual({ to: 'survey_booked', reason: null });
    req.flush({});
    await done;
    expect(cardsIn('survey_booked')).toEqual(['J-00001']);
  });

  it('puts the card back when the API refuses, and says why', async () => {
    const done = page.moveCard(card('1', 'enquiry', 250_000), 'survey_booked');
    await settle();
    backend
      .expectOne('/api/v1/jobs/1/moves')
      .flush(
        { error: { code: 'conflict', message: 'The job is already at “Survey booked”.' } },
        { status: 409, statusText: 'Conflict' },
      );
    await done;
    await settle();
    expect(cardsIn('enquiry')).toEqual(['J-00001']);
    expect(cardsIn('survey_booked')).toEqual([]);
    expect(snack()).toContain('already at “Survey booked”');
  });

  it('asks for a reason before losing a job and sends it', async () => {
    const done = page.moveCard(card('2', 'quoted', 100_000), 'lost');
    await settle(50);
    const box = document.querySelector<HTMLTextAreaElement>('lw-reason-dialog textarea');
    if (!box) throw new Error('no reason dialog');
    box.value = 'Went with a cheaper quote';
    box.dispatchEvent(new Event('input'));
    // jsdom has no requestSubmit: send the submit event a click on "Move" would send.
    document
      .querySelector('lw-reason-dialog form')
      ?.dispatchEvent(new Event('submit', { cancelable: true }));
    await settle(50);
    const req = backend.expectOne('/api/v1/jobs/2/moves');
    expect(req.request.body).toEqual({ to: 'lost', reason: 'Went with a cheaper quote' });
    req.flush({});
    await done;
    expect(cardsIn('lost')).toEqual(['J-00002']);
  });
});
