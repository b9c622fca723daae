import { describe, expect, it } from 'vitest';
import { Coalescer } from '@/lib/ingest/coalesce';

/** A run whose round trips the test finishes by hand, recording which items each carried. */
function manualRun() {
  const groups: number[][] = [];
  const pending: (() => void)[] = [];
  const run = (items: number[]) => {
    groups.push(items);
    return new Promise<number[]>((resolve) => pending.push(() => resolve(items.map((x) => x * 10))));
  };
  return { groups, run, finishNext: () => pending.shift()!() };
}

const turn = () => new Promise((resolve) => setImmediate(resolve));

describe('Coalescer (natural batching of round trips)', () => {
  it('sends an item at once when nothing is out, without waiting for company', async () => {
    const { groups, run, finishNext } = manualRun();
    const c = new Coalescer(run, { maxInFlight: 1, maxWeight: 100 });
    const answer = c.submit(1);
    await turn();
    expect(groups).toEqual([[1]]);
    finishNext();
    expect(await answer).toBe(10);
  });

  it('carries what arrived while a group was out in the next round trip, each caller getting its own answer', async () => {
    const { groups, run, finishNext } = manualRun();
    const c = new Coalescer(run, { maxInFlight: 1, maxWeight: 100 });
    const first = c.submit(1);
    await turn();
    const later = [c.submit(2), c.submit(3), c.submit(4)];
    await turn();
    expect(groups).toEqual([[1]]); // still out: the others wait
    finishNext();
    expect(await first).toBe(10);
    await turn();
    expect(groups).toEqual([[1], [2, 3, 4]]);
    finishNext();
    expect(await Promise.all(later)).toEqual([20, 30, 40]);
  });

  it('keeps up to maxInFlight groups out at once', async () => {
    const { groups, run, finishNext } = manualRun();
    const c = new Coalescer(run, { maxInFlight: 2, maxWeight: 1 });
    const answers = [1, 2, 3].map((x) => c.submit(x));
    await turn();
    expect(groups).toEqual([[1], [2]]);
    finishNext();
    await answers[0];
    await turn();
    expect(groups).toEqual([[1], [2], [3]]);
    finishNext();
    finishNext();
    expect(await Promise.all(answers)).toEqual([10, 20, 30]);
  });

  it('keeps a group at or under maxWeight; an item heavier than that goes alone', async () => {
    const { groups, run, finishNext } = manualRun();
    const c = new Coalescer(run, { maxInFlight: 1, maxWeight: 5, weight: (x: number) => x });
    const blocker = c.submit(1);
    await turn();
    const rest = [2, 3, 9, 1].map((x) => c.submit(x));
    finishNext();
    await blocker;
    for (let i = 0; i < 3; i++) {
      await turn();
      finishNext();
    }
    expect(await Promise.all(rest)).toEqual([20, 30, 90, 10]);
    expect(groups).toEqual([[1], [2, 3], [9], [1]]);
  });

  it('gives every item of a failed group the error, and goes on with the next group', async () => {
    let calls = 0;
    const c = new Coalescer<number, number>(async (items) => {
      calls++;
      if (items.includes(13)) throw new Error('storage down');
      return items;
    }, { maxInFlight: 1, maxWeight: 10 });
    const bad = [c.submit(12), c.submit(13)];
    await expect(bad[0]).rejects.toThrow('storage down');
    await expect(bad[1]).rejects.toThrow('storage down');
    expect(await c.submit(7)).toBe(7);
    expect(calls).toBe(2);
  });

  it('turns a run that throws synchronously into a rejection, not a crash', async () => {
    const c = new Coalescer<number, number>(() => { throw new Error('bad statement'); }, { maxInFlight: 1, maxWeight: 10 });
    await expect(c.submit(1)).rejects.toThrow('bad statement');
  });
});
