// The simulator's HTTP side: a device's store-and-forward queue speaking DESIGN.md §5.
export { NodeSender, type SenderOptions } from './node-sender';
export { postReadings, toWireReading, buildReadingsUrl, type FetchLike, type PostOutcome, type WireReading } from './post-readings';
export { parseRetryAfterSeconds, computeBackoffMs, computeRetryAfterMs } from './backoff';
export { createStats, addStats, sumStats, formatStats, type SenderStats } from './stats';
