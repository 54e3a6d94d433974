import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { serve, type ServerType } from '@hono/node-server';
import { createApp } from '../../src/http/app.js';

/** Real local servers for the client tests: the app itself, and tiny scripted node:http servers. */
export interface Running {
  readonly url: string;
  /** Requests received (scripted servers only). */
  readonly hits: () => number;
  /** Distinct TCP connections accepted (scripted servers only). */
  readonly connections: () => number;
  close(): Promise<void>;
}

export async function startApp(): Promise<Running> {
  const server = await new Promise<ServerType>((done) => {
    const s = serve({ fetch: createApp().fetch, port: 0, hostname: '127.0.0.1' }, () => done(s));
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    hits: () => 0,
    connections: () => 0,
    close: () => closeServer(server as Server),
  };
}

/** A node:http server whose k-th request (0-based) is answered by script(k, req, res). */
export async function startScripted(script: (k: number, req: IncomingMessage, res: ServerResponse) => void): Promise<Running> {
  let hits = 0;
  let connections = 0;
  const server = createServer((req, res) => script(hits++, req, res));
  server.on('connection', () => connections++);
  await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
  const { port } = server.address() as AddressInfo;
  return { url: `http://127.0.0.1:${port}`, hits: () => hits, connections: () => connections, close: () => closeServer(server) };
}

function closeServer(server: Server): Promise<void> {
  server.closeAllConnections?.();
  return new Promise((done) => server.close(() => done()));
}

export function problem(res: ServerResponse, status: number, detail: string, headers: Record<string, string> = {}): void {
  res.writeHead(status, { 'content-type': 'application/problem+json', ...headers });
  res.end(JSON.stringify({ type: '/problems/x', title: 'Scripted', status, detail }));
}

export function ok(res: ServerResponse, body: unknown): void {
  res.writeHead(200, { 'content-type': 'application/json' });
  res.end(JSON.stringify(body));
}
