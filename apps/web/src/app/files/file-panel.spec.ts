import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { meOf } from '../session/me-fixture';
import { Session } from '../session/session.store';
import type { StoredFile } from './file-api';
import { MAX_FILE_BYTES } from './file-checks';
import { FilePanel } from './file-panel';

const JOB = '0b7c0000-0000-4000-8000-000000000002';
const LIST = `/api/v1/files?ownerKind=job&ownerId=${JOB}`;
const PLAN: StoredFile = {
  id: 'f-1',
  fileName: 'site plan.pdf',
  contentType: 'application/pdf',
  sizeBytes: 48_000,
  hasThumbnail: false,
  createdAt: '2026-11-20T10:00:00.000Z',
};

/** A File of the given size without allocating it (the panel reads only name and size). */
function fakeFile(name: string, size: number, type = 'image/jpeg'): File {
  const file = new File(['x'], name, { type });
  Object.defineProperty(file, 'size', { value: size });
  return file;
}

describe('FilePanel', () => {
  let backend: HttpTestingController;
  let fixture: ComponentFixture<FilePanel>;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    const session = TestBed.inject(Session);
    const loaded = session.load();
    backend.expectOne('/api/v1/me').flush(meOf('estimator', ['jobs:read', 'jobs:write']));
    await loaded;
    fixture = TestBed.createComponent(FilePanel);
    fixture.componentRef.setInput('ownerKind', 'job');
    fixture.componentRef.setInput('ownerId', JOB);
    fixture.detectChanges();
    backend.expectOne(LIST).flush([PLAN]);
    await settle();
  });

  afterEach(() => backend.verify());

  async function settle(): Promise<void> {
    for (let turn = 0; turn < 3; turn++) {
      await new Promise((resolve) => setTimeout(resolve));
      await fixture.whenStable();
    }
  }

  const el = () => fixture.nativeElement as HTMLElement;
  const rows = () => [...el().querySelectorAll('.fp__upload')];

  it('lists the files with an icon for a PDF and a way to open each', () => {
    expect(el().querySelector('.fp__name')?.textContent).toBe('site plan.pdf');
    expect(el().querySelector('lw-file-thumb mat-icon')?.textContent?.trim()).toBe(
      'picture_as_pdf',
    );
    expect(el().querySelector('button[aria-label="Open site plan.pdf"]')).not.toBeNull();
  });

  it('refuses a file over 20 MB and a program before sending anything, on their own rows', async () => {
    fixture.componentInstance.send([
      fakeFile('bay 1.jpg', MAX_FILE_BYTES + 1),
      fakeFile('setup.exe', 1000, 'application/octet-stream'),
    ]);
    await settle();
    backend.expectNone('/api/v1/files');
    const texts = rows().map((r) =>
      r.querySelector('[role="alert"] .fp__upload-message')?.textContent?.trim(),
    );
    expect(texts).toEqual([
      '"bay 1.jpg" is larger than the 20 MB limit for one file.',
      '"setup.exe" is not a photo (JPEG, PNG, WebP, HEIC), PDF or CSV file.',
    ]);
  });

  it('shows each upload’s progress and lists the file when it is stored', async () => {
    fixture.componentInstance.send([
      fakeFile('bay 2.jpg', 4000),
      fakeFile('areas.csv', 300, 'text/csv'),
    ]);
    await settle();
    const [photo, sheet] = backend.match('/api/v1/files');
    expect(photo?.request.body).toBeInstanceOf(FormData);
    expect((photo?.request.body as FormData).get('ownerId')).toBe(JOB);
    expect(photo?.request.reportProgress).toBe(true);
    photo?.event({ type: HttpEventType.UploadProgress, loaded: 1000, total: 4000 });
    sheet?.event({ type: HttpEventType.UploadProgress, loaded: 150, total: 300 });
    await settle();
    const bars = [...el().querySelectorAll('mat-progress-bar')].map((b) =>
      b.getAttribute('aria-valuenow'),
    );
    expect(bars).toEqual(['25', '50']);
    photo?.flush([{ ...PLAN, id: 'f-2', fileName: 'bay 2.jpg' }]);
    await settle();
    backend.expectOne(LIST).flush([PLAN]);
    sheet?.flush([{ ...PLAN, id: 'f-3', fileName: 'areas.csv' }]);
    await settle();
    backend.expectOne(LIST).flush([PLAN]);
    await settle();
    expect(rows()[0]?.textContent).toContain('Uploaded');
  });

  it('shows the API’s refusal of the content on the file’s row', async () => {
    fixture.componentInstance.send([fakeFile('holiday.png', 500, 'image/png')]);
    await settle();
    backend.expectOne('/api/v1/files').flush(
      {
        error: {
          code: 'unsupported_media_type',
          message:
            '"holiday.png" is application/x-msdownload: only photos (JPEG, PNG, WebP, HEIC), PDF and CSV files can be uploaded.',
        },
      },
      { status: 415, statusText: 'Unsupported Media Type' },
    );
    await settle();
    expect(rows()[0]?.querySelector('[role="alert"]')?.textContent).toContain(
      '"holiday.png" is application/x-msdownload',
    );
  });
});
