import request from 'supertest';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import { MAX_FILE_BYTES } from '../../libs/jobs/server/src/files/file-upload';
import { createTestApi } from './api-harness';
import { demoIds, sessionFor, type TestSession } from './sessions';
import { createTestJob } from './walker/survey';

const { app, deps } = createTestApi();
afterAll(() => deps.close());

const as = (s: TestSession) => ({ Cookie: s.cookie, 'X-XSRF-TOKEN': s.csrfToken });
let tenantA = '';
let estimator: TestSession;
let installer: TestSession;
let ownerB: TestSession;
let jobId = '';
let siteId = '';

let jpeg: Buffer;
let png: Buffer;
// The smallest PDF a reader opens: header, one empty page, cross-reference table, trailer.
const pdf = Buffer.from(
  '%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[3 0 R]/Count 1>>endobj\n' +
    '3 0 obj<</Type/Page/Parent 2 0 R/MediaBox[0 0 595 842]>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n',
);
const csv = Buffer.from('Area,Width mm,Length mm\nGarage bay 1,6000,6000\nGym floor,20000,15000\n');

beforeAll(async () => {
  const ids = await demoIds(deps.db);
  tenantA = ids.tenant('kestrel-floorworks').id;
  const ownerId = ids.user('owner@kestrel-floorworks.test');
  estimator = await sessionFor(deps.db, ids.user('estimator@kestrel-floorworks.test'), tenantA);
  installer = await sessionFor(deps.db, ids.user('crew@kestrel-floorworks.test'), tenantA);
  const tenantB = ids.tenant('pennick-flooring').id;
  ownerB = await sessionFor(deps.db, ids.user('owner@pennick-flooring.test'), tenantB);
  ({ jobId, siteId } = await createTestJob(deps.db, tenantA, ownerId));
  // A 1200 × 900 photo-like gradient, so the thumbnail has something to shrink.
  const raw = Buffer.alloc(1200 * 900 * 3);
  for (let i = 0; i < raw.length; i++) raw[i] = (i * 7) % 251;
  const image = () => sharp(raw, { raw: { width: 1200, height: 900, channels: 3 } });
  jpeg = await image().jpeg().toBuffer();
  png = await image().resize(300, 200).png().toBuffer();
});

function upload(files: { bytes: Buffer; name: string }[], owner = { kind: 'job', id: '' }) {
  let req = request(app)
    .post('/api/v1/files')
    .set(as(estimator))
    .field('ownerKind', owner.kind)
    .field('ownerId', owner.id || jobId);
  for (const f of files) req = req.attach('files', f.bytes, f.name);
  return req;
}

/** Fetches a presigned link the way a browser would, and answers the bytes. */
async function download(fileId: string, session = estimator, variant = 'original') {
  const link = await request(app)
    .get(`/api/v1/files/${fileId}/link?variant=${variant}`)
    .set(as(session))
    .expect(200);
  expect(link.body.url).toContain('X-Amz-Expires=300');
  const res = await fetch(link.body.url);
  expect(res.status).toBe(200);
  return Buffer.from(await res.arrayBuffer());
}

describe('uploading files', () => {
  let ids: Record<string, string> = {};

  it('takes a JPEG, a PNG, a PDF and a CSV in one request', async () => {
    const res = await upload([
      { bytes: jpeg, name: 'bay-1 roller door.jpg' },
      { bytes: png, name: 'sketch.png' },
      { bytes: pdf, name: 'site plan.pdf' },
      { bytes: csv, name: 'areas.csv' },
    ]);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const types = res.body.map((f: { contentType: string }) => f.contentType);
    expect(types).toEqual(['image/jpeg', 'image/png', 'application/pdf', 'text/csv']);
    expect(res.body.map((f: { hasThumbnail: boolean }) => f.hasThumbnail)).toEqual([
      true,
      true,
      false,
      false,
    ]);
    ids = Object.fromEntries(
      res.body.map((f: { id: string; fileName: string }) => [f.fileName, f.id]),
    );
  });

  it('takes a phone photo in HEIC, shown with an icon when no thumbnail can be made', async () => {
    // An ISO BMFF header with the "heic" brand, as phones write it; sharp's build has no HEVC
    // decoder, so the file is stored without a thumbnail rather than refused.
    const heic = Buffer.alloc(64);
    heic.writeUInt32BE(24, 0);
    heic.write('ftypheic', 4);
    heic.write('mif1heic', 16);
    const res = await upload([{ bytes: heic, name: 'IMG_0042.HEIC' }]);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body[0]).toMatchObject({ contentType: 'image/heic', hasThumbnail: false });
  });

  it('lists them newest first and stores them under the firm’s prefix', async () => {
    const list = await request(app)
      .get(`/api/v1/files?ownerKind=job&ownerId=${jobId}`)
      .set(as(estimator))
      .expect(200);
    // The HEIC came in a later request than the four sent together.
    expect(list.body[0].fileName).toBe('IMG_0042.HEIC');
    expect(list.body.map((f: { fileName: string }) => f.fileName).sort()).toEqual([
      'IMG_0042.HEIC',
      'areas.csv',
      'bay-1 roller door.jpg',
      'site plan.pdf',
      'sketch.png',
    ]);
    const rows = await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx
        .selectFrom('file')
        .leftJoin('fileThumbnail', 'fileThumbnail.fileId', 'file.id')
        .select(['file.objectKey', 'fileThumbnail.objectKey as thumbKey'])
        .where('file.id', 'in', Object.values(ids))
        .execute(),
    );
    expect(rows).toHaveLength(4);
    for (const row of rows) {
      expect(row.objectKey).toMatch(new RegExp(`^tenants/${tenantA}/files/[0-9a-f-]{36}$`));
      if (row.thumbKey) expect(row.thumbKey.startsWith(`tenants/${tenantA}/files/`)).toBe(true);
    }
  });

  it('hands out links that download exactly the bytes uploaded', async () => {
    expect((await download(ids['bay-1 roller door.jpg'])).equals(jpeg)).toBe(true);
    expect((await download(ids['site plan.pdf'])).equals(pdf)).toBe(true);
    expect((await download(ids['areas.csv'])).equals(csv)).toBe(true);
  });

  it('makes a WebP thumbnail no larger than 320 px for images', async () => {
    const thumb = await sharp(
      await download(ids['bay-1 roller door.jpg'], estimator, 'thumbnail'),
    ).metadata();
    expect(thumb.format).toBe('webp');
    expect([thumb.width, thumb.height]).toEqual([320, 240]);
    const none = await request(app)
      .get(`/api/v1/files/${ids['site plan.pdf']}/link?variant=thumbnail`)
      .set(as(estimator));
    expect(none.status).toBe(400);
  });

  it('records the upload on the job timeline', async () => {
    const events = await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx
        .selectFrom('jobEvent')
        .select('summary')
        .where('jobId', '=', jobId)
        .where('kind', '=', 'file-uploaded')
        .execute(),
    );
    expect(events.map((e) => e.summary)).toContain('File uploaded: site plan.pdf (0.0 MB)');
  });

  it('keeps firm B and unbooked installers out: 404 on link, list and delete', async () => {
    const id = ids['sketch.png'];
    for (const session of [ownerB, installer]) {
      expect((await request(app).get(`/api/v1/files/${id}/link`).set(as(session))).status).toBe(
        404,
      );
      expect(
        (await request(app).get(`/api/v1/files?ownerKind=job&ownerId=${jobId}`).set(as(session)))
          .status,
      ).toBe(404);
    }
    expect((await request(app).delete(`/api/v1/files/${id}`).set(as(ownerB))).status).toBe(404);
  });

  it('deletes a file and its objects', async () => {
    const id = ids['sketch.png'];
    const rows = await withTenant(deps.db, { tenantId: tenantA }, (tx) =>
      tx.selectFrom('file').select('objectKey').where('id', '=', id).executeTakeFirstOrThrow(),
    );
    await request(app).delete(`/api/v1/files/${id}`).set(as(estimator)).expect(200);
    expect((await request(app).get(`/api/v1/files/${id}/link`).set(as(estimator))).status).toBe(
      404,
    );
    await expect(
      deps.objectStore.client.statObject(deps.objectStore.bucket, rows.objectKey),
    ).rejects.toThrow();
  });
});

describe('refusing files', () => {
  it('refuses a .png that is really a Windows program, naming the file and what it is', async () => {
    // "MZ" then the PE offset and signature: the start of every Windows executable.
    const exe = Buffer.alloc(512);
    exe.write('MZ', 0);
    exe.writeUInt32LE(0x80, 0x3c);
    exe.write('PE\0\0', 0x80, 'binary');
    const res = await upload([{ bytes: exe, name: 'holiday.png' }]);
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/"holiday\.png" is application\/x-msdownload/);
  });

  it('refuses a .png that is really a ZIP archive', async () => {
    const zip = Buffer.concat([Buffer.from([0x50, 0x4b, 0x05, 0x06]), Buffer.alloc(18)]);
    const res = await upload([{ bytes: zip, name: 'floor.png' }]);
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/"floor\.png" is application\/zip/);
  });

  it('refuses binary named .csv and text that is not named .csv', async () => {
    const nul = await upload([{ bytes: Buffer.from('a,b\n1,\0\n'), name: 'areas.csv' }]);
    expect(nul.status).toBe(415);
    const latin1 = await upload([
      { bytes: Buffer.from([0x41, 0x2c, 0xe9, 0x0a]), name: 'names.csv' },
    ]);
    expect(latin1.status).toBe(415);
    const txt = await upload([{ bytes: csv, name: 'areas.txt' }]);
    expect(txt.status).toBe(415);
    expect(txt.body.error.message).toMatch(/plain text/);
  });

  it('stores nothing when one file of several is refused', async () => {
    const { jobId: other } = await createTestJob(
      deps.db,
      tenantA,
      (await demoIds(deps.db)).user('owner@kestrel-floorworks.test'),
    );
    const res = await upload(
      [
        { bytes: pdf, name: 'ok.pdf' },
        { bytes: Buffer.from('MZ'), name: 'bad.jpg' },
      ],
      { kind: 'job', id: other },
    );
    expect(res.status).toBe(415);
    const list = await request(app)
      .get(`/api/v1/files?ownerKind=job&ownerId=${other}`)
      .set(as(estimator));
    expect(list.body).toEqual([]);
  });

  it('takes a file of exactly 20 MB and refuses one byte more with a 413 naming it', async () => {
    const line = Buffer.from('Garage bay 1,6000,6000\n');
    const exact = Buffer.alloc(MAX_FILE_BYTES, line);
    const ok = await upload([{ bytes: exact, name: 'exact.csv' }]);
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    const big = Buffer.alloc(MAX_FILE_BYTES + 1, line);
    const res = await upload([{ bytes: big, name: 'huge survey.csv' }]);
    expect(res.status).toBe(413);
    expect(res.body.error.message).toBe(
      '"huge survey.csv" is larger than the 20 MB limit for one file.',
    );
  });

  it('answers 400 to a JSON body and 404 to an owner not in the firm', async () => {
    const json = await request(app)
      .post('/api/v1/files')
      .set(as(estimator))
      .send({ ownerKind: 'job', ownerId: jobId });
    expect(json.status).toBe(400);
    const missing = await upload([{ bytes: pdf, name: 'a.pdf' }], {
      kind: 'site',
      id: '00000000-0000-4000-8000-000000000000',
    });
    expect(missing.status).toBe(404);
    const site = await upload([{ bytes: pdf, name: 'site.pdf' }], { kind: 'site', id: siteId });
    expect(site.status).toBe(201);
  });
});
