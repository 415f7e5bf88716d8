import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { startTestApp } from '../support/api-harness';

// How long a browser may keep each file of the client build without asking again (server/app.ts, serveClient).
const dist = fs.mkdtempSync(path.join(os.tmpdir(), 'tt-dist-'));
fs.writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>t</title>');
fs.writeFileSync(path.join(dist, 'main-3KQ2XYZA.js'), 'export {};');
fs.writeFileSync(path.join(dist, 'logo.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
const { app, sequelize } = startTestApp({ CLIENT_DIST: dist });
afterAll(async () => {
  await sequelize.close();
  fs.rmSync(dist, { recursive: true, force: true });
});

describe('client files and caching', () => {
  it('keeps a file named by its content for a year, unchanged', async () => {
    const res = await request(app).get('/main-3KQ2XYZA.js');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  });

  it('has a file without a content name checked hourly, and the page itself on every visit', async () => {
    expect((await request(app).get('/logo.svg')).headers['cache-control']).toBe('public, max-age=3600');
    const page = await request(app).get('/calcs/1');
    expect(page.status).toBe(200);
    expect(page.headers['cache-control']).toBe('public, max-age=0');
  });

  it('has every API answer kept by no browser or proxy, and computes no ETag for it', async () => {
    for (const res of [await request(app).get('/api/session'), await request(app).get('/api/no-such-thing')]) {
      expect(res.headers['cache-control']).toBe('private, no-store');
      expect(res.headers.etag).toBeUndefined();
    }
    // The page still tells a browser when it last changed, so asking again costs a 304 and no body.
    const page = await request(app).get('/calcs/1');
    const again = await request(app).get('/calcs/1').set('If-Modified-Since', page.headers['last-modified']);
    expect(again.status).toBe(304);
  });
});
