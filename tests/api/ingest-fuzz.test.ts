import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { api } from './helpers/stack';
import { createTestNode } from './helpers/fleet';

afterAll(closeDb);

// Bodies spread over many nodes so the per-node rate limit does not hide the parser.
let tokens: { nodeId: number; token: string }[] = [];
beforeAll(async () => {
  tokens = [];
  for (let i = 0; i < 25; i++) tokens.push(await createTestNode('fuzz'));
}, 120_000);

const weird = fc.oneof(
  fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e309', '', ' ', '\u0000', "'; DROP TABLE readings; --", '__proto__', '\r\nX: y'),
  fc.double(), fc.integer(), fc.boolean(), fc.constant(null), fc.string(), fc.object(),
);
const readingish = fc.dictionary(fc.constantFrom('t', 'v', 'seq', 'vp', 'temp', 'rssi', '__proto__', 'constructor', 'node', 'V'), weird, { maxKeys: 7 });
const jsonBody = fc.oneof(
  fc.json(),
  readingish.map((r) => JSON.stringify(r)),
  fc.array(readingish, { maxLength: 20 }).map((readings) => JSON.stringify({ readings })),
  fc.string(),
  fc.nat(40).map((depth) => '['.repeat(depth * 50) + ']'.repeat(depth * 50)),
);
const csvBody = fc.array(fc.array(fc.oneof(fc.string({ maxLength: 12 }), fc.constantFrom('t', 'v', 'vp', 'NaN', '4.8', '2026-12-01T00:00:00Z')), { maxLength: 6 }), { maxLength: 8 })
  .map((rows) => rows.map((r) => r.join(',')).join('\n'));
const body = fc.oneof(
  jsonBody.map((b) => ({ type: 'application/json', b })),
  csvBody.map((b) => ({ type: 'text/csv', b })),
  fc.tuple(fc.constantFrom('text/plain', 'application/xml', 'multipart/form-data', 'application/json; charset=latin1'), fc.string()).map(([type, b]) => ({ type, b })),
);

describe('ingest under malformed input (OWASP API8:2023, ASVS 5.0 V2)', () => {
  it('never answers 5xx, always problem+json for errors, and stores nothing it refused', async () => {
    const before = Number((await db()('readings').whereIn('node_id', tokens.map((t) => t.nodeId)).count({ n: '*' }))[0].n);
    let accepted = 0;
    let i = 0;
    await fc.assert(
      fc.asyncProperty(body, async ({ type, b }) => {
        const { token } = tokens[i++ % tokens.length];
        const res = await api().post('/api/v1/readings').set('authorization', `Bearer ${token}`).set('content-type', type).send(b);
        expect(res.status).toBeLessThan(500);
        if (res.status >= 400) {
          expect(res.headers['content-type']).toContain('application/problem+json');
          expect(res.body.status).toBe(res.status);
        } else accepted += res.body.accepted;
      }),
      { numRuns: 1000 },
    );
    const after = Number((await db()('readings').whereIn('node_id', tokens.map((t) => t.nodeId)).count({ n: '*' }))[0].n);
    expect(after - before).toBe(accepted);
  }, 300_000);
});
