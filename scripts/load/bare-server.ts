import { createServer } from 'node:http';

/**
 * The baseline of `npm run load`: a bare node:http server answering every request with the same
 * 200-byte JSON document. Whatever partsmith reaches is quoted as a fraction of this, measured
 * with the same load generator in the same run on the same cores.
 */
const BODY = Buffer.from(JSON.stringify({ family: { kind: 'partition', n: 1000 }, seed: 'baseline', padding: '' }).padEnd(199, ' ') + '\n');
if (BODY.length !== 200) throw new Error(`baseline body is ${BODY.length} bytes, not 200`);

const server = createServer((_request, response) => {
  response.writeHead(200, { 'content-type': 'application/json; charset=utf-8', 'content-length': BODY.length });
  response.end(BODY);
});
server.keepAliveTimeout = 5000;
server.listen(0, '127.0.0.1', () => {
  const address = server.address();
  if (address && typeof address === 'object') console.log(`bare server listening on http://127.0.0.1:${address.port}`);
});
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => server.close(() => process.exit(0)));
