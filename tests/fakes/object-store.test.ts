// The object-store fake (s3rver) through the real `minio` SDK: put, stat, get, list, a
// presigned GET fetched with fetch, and objects that survive a restart.
// s3rver checks no signatures, so nothing here tests signature or expiry logic.
import * as Minio from 'minio';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ACCESS_KEY, SECRET_KEY, start } from '../../docker-free-dev/object-store/server.mjs';
import { tempDataDir } from './support';

type Store = Awaited<ReturnType<typeof start>>;
const BUCKET = 'latchwork';

let data: Awaited<ReturnType<typeof tempDataDir>>;
let store: Store;

function client(port: number) {
  // The settings the API uses: path-style addressing on 127.0.0.1, no TLS.
  return new Minio.Client({
    endPoint: '127.0.0.1',
    port,
    useSSL: false,
    accessKey: ACCESS_KEY,
    secretKey: SECRET_KEY,
    pathStyle: true,
  });
}

async function readAll(stream: NodeJS.ReadableStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(Buffer.from(chunk as Buffer));
  return Buffer.concat(chunks);
}

beforeAll(async () => {
  data = await tempDataDir('s3');
  store = await start({ port: 0, dataDir: data.dir, buckets: [BUCKET, 'latchwork-exports'] });
});

afterAll(async () => {
  await store?.close();
  await data?.remove();
});

describe('object-store fake', () => {
  it('answers its health check on 127.0.0.1', async () => {
    expect(store.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
    const response = await fetch(`${store.url}/health`);
    expect(response.status).toBe(200);
  });

  it('creates the configured buckets at start', async () => {
    const s3 = client(store.port);
    expect(await s3.bucketExists(BUCKET)).toBe(true);
    expect(await s3.bucketExists('latchwork-exports')).toBe(true);
    expect(await s3.bucketExists('not-there')).toBe(false);
  });

  it('puts, stats, gets and lists an object', async () => {
    const s3 = client(store.port);
    const body = Buffer.from('survey photo bytes: garage floor, bay 2');
    await s3.putObject(BUCKET, 'tenant-a/jobs/J-1001/photo.txt', body, body.length, {
      'Content-Type': 'text/plain',
    });

    const stat = await s3.statObject(BUCKET, 'tenant-a/jobs/J-1001/photo.txt');
    expect(stat.size).toBe(body.length);
    expect(stat.metaData['content-type']).toBe('text/plain');

    const got = await readAll(await s3.getObject(BUCKET, 'tenant-a/jobs/J-1001/photo.txt'));
    expect(got.equals(body)).toBe(true);

    const names: string[] = [];
    for await (const item of s3.listObjectsV2(BUCKET, 'tenant-a/', true)) {
      names.push((item as { name: string }).name);
    }
    expect(names).toEqual(['tenant-a/jobs/J-1001/photo.txt']);
  });

  it('serves a presigned GET to plain fetch', async () => {
    const s3 = client(store.port);
    const body = Buffer.from('%PDF-1.7 quote Q-2031');
    await s3.putObject(BUCKET, 'tenant-a/quotes/Q-2031.pdf', body, body.length, {
      'Content-Type': 'application/pdf',
    });
    const url = await s3.presignedGetObject(BUCKET, 'tenant-a/quotes/Q-2031.pdf', 60);
    expect(url.startsWith(`${store.url}/${BUCKET}/`)).toBe(true);
    const response = await fetch(url);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('application/pdf');
    expect(Buffer.from(await response.arrayBuffer()).equals(body)).toBe(true);
  });

  it('reports a missing object as NotFound', async () => {
    await expect(client(store.port).statObject(BUCKET, 'nope.txt')).rejects.toMatchObject({
      code: 'NotFound',
    });
  });

  it('keeps objects across a restart', async () => {
    await store.close();
    store = await start({ port: 0, dataDir: data.dir, buckets: [BUCKET] });
    const stat = await client(store.port).statObject(BUCKET, 'tenant-a/jobs/J-1001/photo.txt');
    expect(stat.size).toBeGreaterThan(0);
  });
});
