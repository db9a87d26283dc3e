import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { DEFAULT_SLAB_LIMITS } from '@latchwork/jobs-domain';
import { ReadingForm } from './reading-form';
import type { SavedReading } from './survey-api';

const JOB = '0b7c0000-0000-4000-8000-000000000001';

describe('ReadingForm', () => {
  let backend: HttpTestingController;
  let fixture: ComponentFixture<ReadingForm>;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ReadingForm);
    fixture.componentRef.setInput('jobId', JOB);
    fixture.componentRef.setInput('limits', DEFAULT_SLAB_LIMITS);
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const el = () => fixture.nativeElement as HTMLElement;
  const field = (label: string) =>
    [...el().querySelectorAll('mat-form-field')].find(
      (f) => f.querySelector('mat-label')?.textContent?.trim() === label,
    ) as HTMLElement;
  const text = (selector: string) =>
    el().querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';

  async function pick(label: string, option: string): Promise<void> {
    field(label).querySelector<HTMLElement>('.mat-mdc-select-trigger')?.click();
    await fixture.whenStable();
    const found = [...document.querySelectorAll<HTMLElement>('mat-option')].find(
      (o) => o.textContent?.trim() === option,
    );
    if (!found) throw new Error(`no option ${option}`);
    found.click();
    await fixture.whenStable();
  }

  async function type(label: string, value: string): Promise<void> {
    const input = field(label).querySelector('input') as HTMLInputElement;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
  }

  it('offers the methods of the chosen kind and shows its unit', async () => {
    expect(text('.rf__unit')).toBe('%');
    await pick('Reading', 'Surface regularity');
    expect(text('.rf__unit')).toBe('mm');
    field('Method').querySelector<HTMLElement>('.mat-mdc-select-trigger')?.click();
    await fixture.whenStable();
    const methods = [...document.querySelectorAll('mat-option')].map((o) => o.textContent?.trim());
    expect(methods).toEqual(['2 m straightedge']);
  });

  it('shows an emission in both units and previews the verdict with its source', async () => {
    await pick('Reading', 'Moisture emission');
    await type('Value', '3');
    // 3 lb/1000 ft²/24 h = 14.65 g/m²/24 h (NIST SP 811 factors).
    expect(text('mat-hint')).toBe('= 14.65 g/m²/24 h');
    expect(text('.rf__preview')).toContain('Warn');
    expect(text('.rf__preview')).toContain('ASTM F1869');
    // The same figure typed in grams: switch the unit and the hint turns round.
    const grams = [...el().querySelectorAll<HTMLButtonElement>('mat-button-toggle button')].find(
      (b) => b.textContent?.includes('g/m²'),
    );
    grams?.click();
    await type('Value', '20');
    expect(text('.rf__unit')).toBe('g/m²/24 h');
    expect(text('mat-hint')).toBe('= 4.1 lb/1000 ft²/24 h');
    expect(text('.rf__preview')).toContain('Fail');
  });

  it('sends the reading and emits what the API stored', async () => {
    const seen: SavedReading[] = [];
    fixture.componentInstance.recorded.subscribe((r) => seen.push(r));
    await pick('Method', 'in-slab probe');
    await type('Value', '82');
    await type('Where', 'bay 2');
    el().querySelector<HTMLButtonElement>('button[type="submit"]')?.click();
    const req = backend.expectOne(`/api/v1/jobs/${JOB}/survey/readings`);
    expect(req.request.body).toMatchObject({
      kind: 'relative_humidity',
      method: 'in_slab_probe',
      value: 82,
      location: 'bay 2',
    });
    expect(req.request.body.unit).toBeUndefined();
    const stored = {
      ...req.request.body,
      id: 'r1',
      status: 'fail',
      message: 'm',
      source: 's',
      unit: null,
    };
    req.flush(stored);
    await fixture.whenStable();
    await new Promise((r) => setTimeout(r));
    expect(seen).toEqual([stored]);
    // Ready for the next reading: the emptied value is not flagged as a mistake.
    expect((field('Value').querySelector('input') as HTMLInputElement).value).toBe('');
    expect(text('mat-error')).toBe('');
  });

  it('puts the API’s field problem under the field and refuses an empty value', async () => {
    el().querySelector<HTMLButtonElement>('button[type="submit"]')?.click();
    await fixture.whenStable();
    backend.expectNone(`/api/v1/jobs/${JOB}/survey/readings`);
    expect(text('mat-error')).toBe('Enter the reading.');
    await type('Value', '140');
    el().querySelector<HTMLButtonElement>('button[type="submit"]')?.click();
    backend.expectOne(`/api/v1/jobs/${JOB}/survey/readings`).flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Relative humidity must be between 0 and 100.',
          details: {
            problems: [{ path: 'value', message: 'Relative humidity must be between 0 and 100.' }],
          },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    await new Promise((r) => setTimeout(r));
    await fixture.whenStable();
    expect(text('mat-error')).toBe('Relative humidity must be between 0 and 100.');
  });
});
