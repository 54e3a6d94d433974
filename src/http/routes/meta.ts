import { z } from 'zod';
import { APP_VERSION } from '../../version.js';
import { ALGORITHM_VERSION } from '../../core/seeding.js';
import { defineEndpoint, type Endpoint } from '../endpoint.js';
import { openApiDocument } from '../openapi.js';
import { respondWithJson } from '../respond.js';
import { PROBLEM_RESPONSES } from './docs.js';

export const healthEndpoint = defineEndpoint({
  path: '/healthz',
  summary: 'Liveness',
  description: 'Always {"status":"ok"} with the service and algorithm versions.',
  query: z.strictObject({}),
  responses: { '200': { description: 'The service is up.', contentTypes: ['application/json'] }, '400': PROBLEM_RESPONSES['400'] },
  handle: (request) => respondWithJson(request, '/healthz', null, { status: 'ok', version: APP_VERSION, algorithmVersion: ALGORITHM_VERSION }),
});

/** /openapi.json describes every endpoint, itself included. */
export function openApiEndpoint(all: () => readonly Endpoint[]) {
  return defineEndpoint({
    path: '/openapi.json',
    summary: 'This API, as OpenAPI 3.1',
    description: 'Generated from the same zod schemas that validate the requests.',
    query: z.strictObject({}),
    responses: { '200': { description: 'The OpenAPI document.', contentTypes: ['application/json'] }, '400': PROBLEM_RESPONSES['400'] },
    handle: (request) => respondWithJson(request, '/openapi.json', {}, openApiDocument(all())),
  });
}
