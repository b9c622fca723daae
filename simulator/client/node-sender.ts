import { setTimeout as sleep } from 'node:timers/promises';
import type { SimReading } from '../physics/types';
import { computeBackoffMs, computeRetryAfterMs } from './backoff';
import { buildReadingsUrl, postReadings, toWireReading, type FetchLike, type PostOutcome } from './post-readings';
import { createStats, type SenderStats } from './stats';

// Store-and-forward for one node: the physics appends readings, one loop posts the head of
// the queue. A reading leaves the queue only when the server acknowledged it (2xx) or refused
// it for good (4xx other than 429); everything else keeps it and tries again later.

export interface SenderOptions {
  nodeId: string;
  token: string;
  baseUrl: string;
  fetchImpl?: FetchLike;
  /** The contract allows 1000 readings a post. */
  maxBatch?: number;
  /** Least time between two partial posts; a full batch goes at once (backlog is not throttled). */
  minPostGapMs?: number;
  timeoutMs?: number;
  backoffBaseMs?: number;
  backoffMaxMs?: number;
  /** Cadence advice from the server (next_report_s). */
  onAdvice?: (seconds: number) => void;
  onAck?: (info: { readings: SimReading[]; accepted: number; duplicates: number; state: string | null }) => void;
  log?: (line: string) => void;
  random?: () => number;
}

const MAX_BODY_BYTES = 256 * 1024; // DESIGN.md §5 (413 above it)

export class NodeSender {
  readonly nodeId: string;
  private readonly opts: Required<Omit<SenderOptions, 'onAdvice' | 'onAck' | 'fetchImpl'>> & Pick<SenderOptions, 'onAdvice' | 'onAck' | 'fetchImpl'>;
  private readonly url: string;
  private readonly queue: SimReading[] = [];
  private readonly counters: SenderStats = createStats();
  private readonly stopper = new AbortController();
  private wake: (() => void) | null = null;
  private loop: Promise<void> | null = null;
  private failures = 0;
  private notBeforeMs = 0;
  private gapUntilMs = 0;
  private batchLimit: number;
  /** The latest reading time that has left the queue (acked or dropped), for resuming. */
  doneThrough: Date | null = null;
  lastState: string | null = null;

  constructor(opts: SenderOptions) {
    this.nodeId = opts.nodeId;
    this.opts = {
      maxBatch: 1000, minPostGapMs: 2000, timeoutMs: 10_000, backoffBaseMs: 1000, backoffMaxMs: 60_000,
      log: (line) => console.error(line), random: Math.random, ...opts,
    };
    this.url = buildReadingsUrl(opts.baseUrl);
    this.batchLimit = this.opts.maxBatch;
  }

  enqueue(readings: SimReading[]): void {
    if (!readings.length) return;
    this.queue.push(...readings);
    this.counters.emitted += readings.length;
    this.wake?.();
  }

  start(): void {
    this.loop ??= this.run();
  }

  /** Stops the loop; an in-flight post is aborted (the server stores a batch whole or not at all). */
  async stop(): Promise<void> {
    this.stopper.abort();
    this.wake?.();
    await this.loop;
  }

  get queued(): number {
    return this.queue.length;
  }

  stats(): SenderStats {
    return { ...this.counters, errors: { ...this.counters.errors }, queued: this.queue.length };
  }

  private async run(): Promise<void> {
    const signal = this.stopper.signal;
    while (!signal.aborted) {
      if (!this.queue.length) {
        await new Promise<void>((resolve) => { this.wake = resolve; });
        this.wake = null;
        continue;
      }
      const full = this.queue.length >= this.batchLimit;
      const waitMs = Math.max(this.notBeforeMs, full ? 0 : this.gapUntilMs) - Date.now();
      if (waitMs > 0) {
        await sleep(waitMs, undefined, { signal }).catch(() => undefined);
        continue;
      }
      try {
        await this.postHead();
      } catch (e) {
        // A bug of ours, not the server's answer: keep the readings and back off.
        this.opts.log(`[sim] node ${this.nodeId}: ${(e as Error).message}`);
        this.apply({ outcome: { kind: 'retry', reason: 'client', retryAfterSeconds: null }, sent: [] });
      }
    }
  }

  private async postHead(): Promise<void> {
    const batch = this.queue.slice(0, this.batchLimit);
    let wire = batch.map(toWireReading);
    while (wire.length > 1 && JSON.stringify({ readings: wire }).length > MAX_BODY_BYTES) wire = wire.slice(0, wire.length >> 1);
    const sent = batch.slice(0, wire.length);
    this.counters.posts += 1;
    this.counters.sent += sent.length;
    this.gapUntilMs = Date.now() + this.opts.minPostGapMs;
    const outcome = await postReadings({
      url: this.url, token: this.opts.token, readings: wire, fetchImpl: this.opts.fetchImpl, timeoutMs: this.opts.timeoutMs,
      stopSignal: this.stopper.signal,
    });
    this.apply({ outcome, sent });
  }

  private apply({ outcome, sent }: { outcome: PostOutcome; sent: SimReading[] }): void {
    const { random } = this.opts;
    switch (outcome.kind) {
      case 'aborted':
        return; // stopping: the readings stay where they were
      case 'acked': {
        this.failures = 0;
        this.take(sent.length);
        this.counters.acked += sent.length;
        this.counters.accepted += outcome.accepted;
        this.counters.duplicates += outcome.duplicates;
        if (!outcome.countsKnown || outcome.accepted + outcome.duplicates !== sent.length) this.counters.mismatches += 1;
        this.lastState = outcome.state;
        if (outcome.nextReportSeconds) this.opts.onAdvice?.(outcome.nextReportSeconds);
        this.opts.onAck?.({ readings: sent, accepted: outcome.accepted, duplicates: outcome.duplicates, state: outcome.state });
        return;
      }
      case 'slow-down':
        this.countError('429');
        this.notBeforeMs = Date.now() + computeRetryAfterMs({ seconds: outcome.retryAfterSeconds ?? 1, random });
        return;
      case 'retry': {
        this.failures += 1;
        this.countError(outcome.reason);
        const { backoffBaseMs: baseMs, backoffMaxMs: maxMs } = this.opts;
        this.notBeforeMs = Date.now() + (outcome.retryAfterSeconds !== null
          ? computeRetryAfterMs({ seconds: outcome.retryAfterSeconds, random })
          : computeBackoffMs({ failures: this.failures, baseMs, maxMs, random }));
        return;
      }
      case 'rejected':
        this.reject({ outcome, sent });
    }
  }

  /** A 4xx that retrying cannot fix: drop what the server named, or the whole post. */
  private reject({ outcome, sent }: { outcome: Extract<PostOutcome, { kind: 'rejected' }>; sent: SimReading[] }): void {
    this.countError(String(outcome.status));
    if (outcome.status === 413 && sent.length > 1) {
      this.batchLimit = Math.max(1, sent.length >> 1); // too large after all: halve and resend
      return;
    }
    const bad = outcome.badIndexes?.filter((i) => i < sent.length) ?? null;
    this.opts.log(`[sim] node ${this.nodeId}: ${outcome.status} ${outcome.title}${outcome.detail ? ` — ${outcome.detail}` : ''}; dropping ${bad ? bad.length : sent.length} of ${sent.length}`);
    if (bad && bad.length) {
      // The other items of an all-or-nothing batch were not stored: keep them, at the head.
      const badSet = new Set(bad);
      const keep = sent.filter((_, i) => !badSet.has(i));
      this.queue.splice(0, sent.length, ...keep);
      this.counters.dropped += bad.length;
      return;
    }
    this.take(sent.length);
    this.counters.dropped += sent.length;
  }

  private take(count: number): void {
    const gone = this.queue.splice(0, count);
    if (gone.length) this.doneThrough = gone[gone.length - 1].t;
  }

  private countError(reason: string): void {
    this.counters.errors[reason] = (this.counters.errors[reason] ?? 0) + 1;
  }
}
