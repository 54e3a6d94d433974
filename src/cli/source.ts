import type { PartsmithClient } from '../client/index.js';
import { PartsmithError } from '../client/errors.js';
import { createApp } from '../http/app.js';

/** An answer whose status was 2xx: headers and the body bytes as they arrive. */
export interface Answer {
  header(name: string): string | undefined;
  readonly body: AsyncIterable<Uint8Array>;
}

/**
 * Where the CLI's answers come from: the service's app in this process, or a running service
 * (--url) through the client (keep-alive, retries). Either way the bytes are the service's.
 * Non-2xx answers throw PartsmithError.
 */
export interface Source {
  get(pathAndQuery: string): Promise<Answer>;
  close(): Promise<void>;
}

/** Origin of the in-process requests; never contacted. */
const LOCAL_ORIGIN = 'http://partsmith.local';

/** GET of a path and query answered by the service's app in this process (no server, no network). */
export function localFetch(): (pathAndQuery: string) => Promise<Response> {
  const app = createApp();
  return async (pathAndQuery) => app.fetch(new Request(LOCAL_ORIGIN + pathAndQuery));
}

export function localSource(): Source {
  const fetch = localFetch();
  return {
    async get(pathAndQuery) {
      const response = await fetch(pathAndQuery);
      if (response.status < 200 || response.status >= 300) {
        throw PartsmithError.fromBody(response.status, response.headers.get('content-type') ?? undefined, await response.text(), pathAndQuery);
      }
      return {
        header: (name) => response.headers.get(name) ?? undefined,
        body: (response.body ?? emptyBody()) as unknown as AsyncIterable<Uint8Array>,
      };
    },
    close: async () => {},
  };
}

/** The client (and undici) is loaded only for --url, keeping local runs quick to start. */
export async function remoteSource(baseUrl: string): Promise<Source> {
  const { createClient } = await import('../client/index.js');
  let client: PartsmithClient;
  try {
    client = createClient({ baseUrl });
  } catch {
    throw new RangeError(`--url must be an http:// or https:// URL, got ${JSON.stringify(baseUrl)}`);
  }
  return {
    async get(pathAndQuery) {
      // The client joins paths to the base URL and keeps the query as given.
      const response = await client.get(pathAndQuery);
      return {
        header: (name) => {
          const value = response.headers[name.toLowerCase()];
          return Array.isArray(value) ? value.join(', ') : value;
        },
        body: response.body,
      };
    },
    close: () => client.close(),
  };
}

async function* emptyBody(): AsyncGenerator<Uint8Array> {}
