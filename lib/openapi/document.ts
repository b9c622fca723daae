import { z } from 'zod';
import { MAX_BODY_BYTES, MAX_READINGS_PER_POST, batchSchema, ingestReplySchema, readingSchema } from '../schemas/reading';

/**
 * OpenAPI 3.1 description of the public device contract, generated from the same zod schemas
 * the route validates with (zod's own JSON Schema output; OpenAPI 3.1 uses JSON Schema 2020-12).
 */
const schema = (s: z.ZodType) => z.toJSONSchema(s, { target: 'draft-2020-12', io: 'input', unrepresentable: 'any' });

const problem = {
  type: 'object',
  description: 'RFC 9457 problem details',
  properties: {
    type: { type: 'string' }, title: { type: 'string' }, status: { type: 'integer' }, detail: { type: 'string' },
    errors: { type: 'array', items: { type: 'object', properties: { pointer: { type: 'string', description: 'RFC 6901 JSON pointer' }, detail: { type: 'string' } } } },
  },
  required: ['title', 'status'],
};

const problemResponse = (description: string, retryAfter = false) => ({
  description,
  ...(retryAfter ? { headers: { 'Retry-After': { schema: { type: 'integer' }, description: 'seconds' } } } : {}),
  content: { 'application/problem+json': { schema: { $ref: '#/components/schemas/Problem' } } },
});

export function buildOpenApiDocument(serverUrl: string) {
  const reading = schema(readingSchema);
  const batch = schema(batchSchema) as { properties: Record<string, Record<string, unknown>> };
  batch.properties.readings = { type: 'array', minItems: 1, maxItems: MAX_READINGS_PER_POST, items: { $ref: '#/components/schemas/Reading' } };
  return {
    openapi: '3.1.0',
    info: {
      title: 'Duskwatch device ingest',
      version: '1.0.0',
      description: `Nodes post their bank voltage. Body up to ${MAX_BODY_BYTES / 1024} KiB and ${MAX_READINGS_PER_POST} readings. A reading repeated for the same node and t is a duplicate: counted, stored once. A batch is all or nothing.`,
    },
    servers: [{ url: serverUrl }],
    components: {
      securitySchemes: { deviceToken: { type: 'http', scheme: 'bearer', bearerFormat: 'JWT', description: 'One token per device credential, shown once when it is made.' } },
      schemas: { Reading: reading, Batch: batch, IngestReply: schema(ingestReplySchema), Problem: problem },
    },
    paths: {
      '/api/v1/readings': {
        post: {
          summary: 'Post one reading, a batch, or CSV',
          security: [{ deviceToken: [] }],
          requestBody: {
            required: true,
            content: {
              'application/json': { schema: { oneOf: [{ $ref: '#/components/schemas/Reading' }, { $ref: '#/components/schemas/Batch' }] } },
              'text/csv': { schema: { type: 'string', description: 'A header line naming t, v, seq, vp, temp, rssi (v required), then one reading a line.' } },
            },
          },
          responses: {
            '200': { description: 'Stored (after the commit returned)', content: { 'application/json': { schema: { $ref: '#/components/schemas/IngestReply' } } } },
            '400': problemResponse('Malformed body'),
            '401': problemResponse('Missing, malformed, forged or revoked token (WWW-Authenticate: Bearer)'),
            '413': problemResponse('Over 1000 readings or 256 KiB'),
            '415': problemResponse('Not application/json or text/csv'),
            '422': problemResponse('Invalid values, one pointer per bad item; nothing stored'),
            '429': problemResponse('Posting too fast', true),
            '503': problemResponse('Storage unavailable; nothing stored, retry later', true),
          },
        },
      },
    },
  };
}
