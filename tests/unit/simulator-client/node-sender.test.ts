import fc from 'fast-check';
import { afterEach, describe, expect, it } from 'vitest';
import { NodeSender, type SenderOptions } from '../../../simulator/client/node-sender';
import { createFakeServer, makeReadings, waitUntil, type Answer } from './fake-server';

// The store-and-forward queue against a fake server. Behaviour required by DESIGN.md §5 and
// issue 5 (at-least-once delivery, batches of up to 1000, Retry-After on 429 and 503).

const senders: NodeSender[] = [];
afterEach(async () => {
  await Promise.all(senders.splice(0).map((s) => s.stop()));
});

function makeSender(script: (i: number) => Answer, opts: Partial<SenderOptions> = {}) {
  const server = createFakeServer(script);
  const sender = new NodeSender({
    nodeId: '7', token: 'tok.en.x', baseUrl: 'http://127.0.0.1:9/', fetchImpl: server.fetch,
    minPostGapMs: 0, backoffBaseMs: 2, backoffMaxMs: 20, timeoutMs: 200, log: () => undefined, ...opts,
  });
  senders.push(sender);
  sender.start();
  return { server, sender };
}

describe('the simulator client (store-and-forward)', () => {
  it('posts {"readings": [...]} as application/json with RFC 3339 times and the device token', async () => {
    const { server, sender } = makeSender(() => ({ status: 200 }));
    sender.enqueue(makeReadings({ count: 1 }));
    await waitUntil(() => sender.stats().acked === 1);
    const { url, init } = server.requests[0];
    expect(url).toBe('http://127.0.0.1:9/api/v1/readings'); // DESIGN.md §5
    const headers = init.headers as Record<string, string>;
    expect(headers['content-type']).toBe('application/json');
    expect(headers.authorization).toBe('Bearer tok.en.x');
    const body = JSON.parse(String(init.body));
    expect(Object.keys(body)).toEqual(['readings']);
    expect(Object.keys(body.readings[0]).sort()).toEqual(['rssi', 'seq', 't', 'temp', 'v', 'vp']); // DESIGN.md §5 field names
    // RFC 3339 §5.6 date-time, UTC: derived here from the grammar.
    expect(body.readings[0].t).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z$/);
  });

  it('keeps the readings through 503s and delivers them once the server is back', async () => {
    const { server, sender } = makeSender((i) => (i < 3 ? { status: 503 } : { status: 200 }));
    sender.enqueue(makeReadings({ count: 5 }));
    await waitUntil(() => sender.stats().queued === 0);
    expect(server.posts.map((p) => p.status)).toEqual([503, 503, 503, 200]);
    expect(server.stored.size).toBe(5);
    expect(sender.stats()).toMatchObject({ emitted: 5, acked: 5, accepted: 5, dropped: 0, errors: { 503: 3 } });
  });

  it('waits the Retry-After of a 503 and of a 429 before trying again (RFC 9110 §10.2.3)', async () => {
    for (const status of [503, 429]) {
      const { server, sender } = makeSender((i) => (i === 0 ? { status, retryAfter: '1' } : { status: 200 }), { backoffBaseMs: 1 });
      sender.enqueue(makeReadings({ count: 2 }));
      await waitUntil(() => sender.stats().acked === 2, 4000);
      const waitedMs = server.posts[1].at - server.posts[0].at;
      expect(waitedMs).toBeGreaterThanOrEqual(1000); // "Retry-After: 1" is one second
      expect(waitedMs).toBeLessThan(1600); // plus at most a fifth of jitter (derived here) and scheduling
    }
  });

  it('sends a backlog in batches of at most 1000, full batches without waiting', async () => {
    const { server, sender } = makeSender(() => ({ status: 200 }), { minPostGapMs: 60_000 });
    sender.enqueue(makeReadings({ count: 2000 }));
    await waitUntil(() => sender.stats().acked === 2000);
    expect(server.posts.map((p) => p.count)).toEqual([1000, 1000]); // DESIGN.md §5: up to 1000 a post
    sender.enqueue(makeReadings({ count: 1, fromMs: Date.UTC(2026, 11, 3) }));
    await new Promise((r) => setTimeout(r, 100));
    expect(server.posts).toHaveLength(2); // a lone reading waits for the gap between posts
  });

  it('sends what piled up during an outage as one batch', async () => {
    let down = true;
    const { server, sender } = makeSender(() => (down ? 'network' : { status: 200 }));
    for (let i = 0; i < 30; i += 1) {
      sender.enqueue(makeReadings({ count: 1, fromMs: Date.UTC(2026, 11, 1) + i * 60_000 }));
      await new Promise((r) => setTimeout(r, 2));
    }
    down = false;
    await waitUntil(() => sender.stats().queued === 0);
    const ok = server.posts.filter((p) => p.status === 200);
    expect(ok[0].count).toBeGreaterThan(1);
    expect(server.stored.size).toBe(30);
  });

  it('passes next_report_s on as cadence advice', async () => {
    const advice: number[] = [];
    const { sender } = makeSender(() => ({ status: 200, nextReportSeconds: 1500 }), { onAdvice: (s) => advice.push(s) });
    sender.enqueue(makeReadings({ count: 1 }));
    await waitUntil(() => advice.length === 1);
    expect(advice).toEqual([1500]);
  });

  it('drops a batch the server refuses for good (401), counts it, and goes on', async () => {
    const { server, sender } = makeSender((i) => (i === 0 ? { status: 401 } : { status: 200 }));
    sender.enqueue(makeReadings({ count: 3 }));
    await waitUntil(() => sender.stats().queued === 0);
    sender.enqueue(makeReadings({ count: 2, fromMs: Date.UTC(2026, 11, 2) }));
    await waitUntil(() => sender.stats().acked === 2);
    expect(sender.stats()).toMatchObject({ dropped: 3, errors: { 401: 1 } });
    expect(server.stored.size).toBe(2);
  });

  it('on a 422 drops only the items the pointers name and resends the rest', async () => {
    const body = { status: 422, errors: [{ pointer: '/readings/1/t', detail: 'too far ahead' }] };
    const { server, sender } = makeSender((i) => (i === 0 ? { status: 422, body } : { status: 200 }));
    const readings = makeReadings({ count: 3 });
    sender.enqueue(readings);
    await waitUntil(() => sender.stats().queued === 0);
    expect([...server.stored.keys()]).toEqual([readings[0].t.getTime(), readings[2].t.getTime()]);
    expect(sender.stats().dropped).toBe(1);
  });

  it('retries after a timeout', async () => {
    const { server, sender } = makeSender((i) => (i === 0 ? 'hang' : { status: 200 }), { timeoutMs: 50 });
    sender.enqueue(makeReadings({ count: 1 }));
    await waitUntil(() => sender.stats().acked === 1);
    expect(sender.stats().errors).toEqual({ timeout: 1 });
    expect(server.stored.size).toBe(1);
  });

  it('never loses a reading and stores none twice, whatever the server does', async () => {
    const answer = fc.oneof(
      fc.constant<Answer>({ status: 200 }), fc.constant<Answer>({ status: 503, retryAfter: '0' }),
      fc.constant<Answer>({ status: 500 }), fc.constant<Answer>({ status: 503, storeFirst: true }),
      fc.constant<Answer>('network'), fc.constant<Answer>('hang'), fc.constant<Answer>({ status: 429, retryAfter: '0' }),
    );
    await fc.assert(fc.asyncProperty(fc.array(answer, { maxLength: 12 }), fc.array(fc.integer({ min: 1, max: 40 }), { minLength: 1, maxLength: 6 }),
      async (answers, chunks) => {
        // After the scripted failures the server works, as it does once MariaDB is back.
        const { server, sender } = makeSender((i) => answers[i] ?? { status: 200 }, { timeoutMs: 20, maxBatch: 25 });
        let fromMs = Date.UTC(2026, 11, 1);
        let emitted = 0;
        for (const count of chunks) {
          sender.enqueue(makeReadings({ count, fromMs }));
          fromMs += count * 60_000;
          emitted += count;
          await new Promise((r) => setTimeout(r, 1));
        }
        await waitUntil(() => sender.stats().queued === 0, 10_000);
        const s = sender.stats();
        expect(server.stored.size).toBe(emitted); // none lost (the Map keys by t, so none twice either)
        expect(s.acked).toBe(emitted); // every reading was acknowledged exactly once…
        expect(s.accepted + s.duplicates).toBe(s.acked); // …some as duplicates of a commit whose answer was lost
        expect(s.duplicates).toBe(server.duplicates);
        expect(s.dropped).toBe(0);
      }), { numRuns: 25 });
  }, 60_000);
});
