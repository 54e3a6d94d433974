import { z } from 'zod';
import { APP_VERSION } from '../version.js';
import type { Endpoint } from './endpoint.js';

/**
 * The OpenAPI 3.1 document, generated from the endpoints' zod schemas (z.toJSONSchema), so a
 * parameter is never described twice. OpenAPI 3.1 schemas are JSON Schema 2020-12.
 */
export function openApiDocument(endpoints: readonly Endpoint[]): Record<string, unknown> {
  const paths: Record<string, unknown> = {};
  for (const endpoint of endpoints) {
    const parameters = Object.entries(endpoint.query.shape).map(([name, field]) => {
      const schema = z.toJSONSchema(field as z.ZodType, { io: 'input', unrepresentable: 'any' }) as Record<string, unknown>;
      delete schema.$schema;
      const description = schema.description;
      delete schema.description;
      return {
        name,
        in: 'query',
        // A field that accepts "absent" (optional or defaulted) is not required.
        required: !(field as z.ZodType).safeParse(undefined).success,
        ...(description ? { description } : {}),
        schema,
      };
    });
    const responses: Record<string, unknown> = {};
    for (const [status, doc] of Object.entries(endpoint.responses)) {
      responses[status] = {
        description: doc.description,
        ...(doc.contentTypes.length > 0 ? { content: Object.fromEntries(doc.contentTypes.map((t) => [t, {}])) } : {}),
      };
    }
    paths[endpoint.path] = { get: { summary: endpoint.summary, description: endpoint.description, parameters, responses } };
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'partsmith',
      version: APP_VERSION,
      description: 'Uniformly random integer partitions and compositions of exact size n, and set partitions of n items, seeded and replayable.',
    },
    paths,
  };
}
