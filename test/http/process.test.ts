import { request } from 'undici';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../src/http/app.js';
import { startServer, type RunningServer } from '../support/server-process.js';

describe('the server started as `npm start` does', () => {
  let server: RunningServer;
  beforeAll(async () => {
    server = await startServer();
  });
  afterAll(async () => {
    await server?.stop();
  });

  it('prints a ready-to-paste example URL that works', async () => {
    const example = /curl '([^']+)'/.exec(server.output())?.[1];
    expect(example).toBeDefined();
    const response = await request(example!);
    expect(response.statusCode).toBe(200);
    const body = (await response.body.json()) as { samples: number[][] };
    expect(body.samples).toHaveLength(3);
  });

  it('answers over HTTP exactly as the app does in-process', async () => {
    const path = '/v1/partitions?n=200&count=5&seed=proc&format=ndjson';
    const overHttp = await request(server.baseUrl + path);
    const inProcess = await createApp().fetch(new Request(`http://x${path}`));
    expect(overHttp.statusCode).toBe(200);
    expect(await overHttp.body.text()).toBe(await inProcess.text());
  });

  it('answers errors as problem+json over HTTP too', async () => {
    const response = await request(`${server.baseUrl}/v1/partitions?n=oops`);
    expect(response.statusCode).toBe(400);
    expect(response.headers['content-type']).toMatch(/^application\/problem\+json/);
    await response.body.json();
  });

  it('stops when asked', async () => {
    await server.stop();
    await expect(request(`${server.baseUrl}/healthz`)).rejects.toThrow();
  });
});
