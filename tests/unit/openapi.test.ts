import { describe, expect, it } from 'vitest';
import { buildOpenApiDocument } from '@/lib/openapi/document';

describe('the OpenAPI description of the ingest contract', () => {
  const doc = buildOpenApiDocument('http://127.0.0.1:3000');
  it('is OpenAPI 3.1 and names every status of DESIGN.md §5', () => {
    expect(doc.openapi).toBe('3.1.0');
    expect(Object.keys(doc.paths['/api/v1/readings'].post.responses).sort()).toEqual(['200', '400', '401', '413', '415', '422', '429', '503']);
  });
  it('is generated from the zod schema the route validates with: the same fields, v required, nothing else allowed', () => {
    const reading = doc.components.schemas.Reading as { properties: Record<string, unknown>; required: string[]; additionalProperties: boolean };
    expect(Object.keys(reading.properties).sort()).toEqual(['rssi', 'seq', 't', 'temp', 'v', 'vp']);
    expect(reading.required).toEqual(['v']);
    expect(reading.additionalProperties).toBe(false);
  });
});
