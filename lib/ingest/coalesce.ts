/**
 * Natural batching for the ingest hot path: requests that arrive while the database is busy
 * are carried together by the next round trip, instead of each waiting for a connection of
 * its own. Nothing is held back on a timer: an item submitted while fewer than `maxInFlight`
 * groups are out goes at the end of the current turn of the event loop (with whatever else
 * arrived in that turn). Under load the groups grow by themselves, so one commit (one log
 * flush) covers many devices' readings, and every caller still gets its answer only after the
 * round trip that carried its item has returned.
 */
export interface CoalescerOptions<I> {
  /** Groups out at once; more arrivals wait for one to return and then go together. */
  maxInFlight: number;
  /** A group's total weight stays at or under this (an item heavier than it goes alone). */
  maxWeight: number;
  weight?: (item: I) => number;
}

type Waiting<I, O> = { item: I; resolve: (out: O) => void; reject: (error: unknown) => void };

export class Coalescer<I, O> {
  private queue: Waiting<I, O>[] = [];
  private inFlight = 0;
  private scheduled = false;

  /** `run` answers one output per item, in order; if it throws, every item of the group gets that error. */
  constructor(
    private readonly run: (items: I[]) => Promise<O[]>,
    private readonly options: CoalescerOptions<I>,
  ) {}

  submit(item: I): Promise<O> {
    return new Promise<O>((resolve, reject) => {
      this.queue.push({ item, resolve, reject });
      this.schedule();
    });
  }

  private schedule() {
    if (this.scheduled) return;
    this.scheduled = true;
    setImmediate(() => {
      this.scheduled = false;
      this.pump();
    });
  }

  private pump() {
    while (this.inFlight < this.options.maxInFlight && this.queue.length) this.send(this.takeGroup());
  }

  private takeGroup(): Waiting<I, O>[] {
    const weight = this.options.weight ?? (() => 1);
    const group = [this.queue.shift()!];
    let total = weight(group[0].item);
    while (this.queue.length && total + weight(this.queue[0].item) <= this.options.maxWeight) {
      const next = this.queue.shift()!;
      total += weight(next.item);
      group.push(next);
    }
    return group;
  }

  private send(group: Waiting<I, O>[]) {
    this.inFlight++;
    let outputs: Promise<O[]>;
    try {
      outputs = this.run(group.map((g) => g.item));
    } catch (error) {
      outputs = Promise.reject(error);
    }
    outputs
      .then(
        (outs) => group.forEach((g, i) => g.resolve(outs[i])),
        (error) => group.forEach((g) => g.reject(error)),
      )
      .finally(() => {
        this.inFlight--;
        this.pump();
      });
  }
}

