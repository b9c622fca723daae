import { z } from 'zod';

/**
 * One reading of the device contract (DESIGN.md §5). Unknown fields are refused, so a typo
 * in firmware is caught at the first post instead of silently dropping data.
 */
export const MAX_READINGS_PER_POST = 1000;
export const MAX_BODY_BYTES = 256 * 1024;
export const MAX_FUTURE_SECONDS = 5 * 60;
export const MAX_AGE_DAYS = 400;

export const RFC3339 = /^\d{4}-\d{2}-\d{2}[Tt ]\d{2}:\d{2}:\d{2}(\.\d{1,9})?([Zz]|[+-]\d{2}:\d{2})$/;

export const readingTime = z.union([
  z.string().regex(RFC3339, 'Use an RFC 3339 time such as 2026-12-01T21:30:00Z, or Unix seconds.'),
  z.number().finite('Use Unix seconds.').min(0, 'Use Unix seconds.'),
]);

export const readingSchema = z.object({
  t: readingTime.optional(),
  v: z.number({ message: 'v (bank volts) is required and must be a number.' }).finite().min(-1, 'v must be ≥ −1 V.').max(100, 'v must be ≤ 100 V.'),
  seq: z.number().int('seq must be a whole number.').min(0).max(4_294_967_295).optional(),
  vp: z.number().finite().min(-1).max(100, 'vp (panel volts) must be ≤ 100 V.').optional(),
  temp: z.number().finite().min(-80, 'temp must be ≥ −80 °C.').max(150, 'temp must be ≤ 150 °C.').optional(),
  rssi: z.number().int('rssi must be whole dBm.').min(-150).max(20).optional(),
}).strict();

export const batchSchema = z.object({
  readings: z.array(z.unknown()).min(1, 'Send at least one reading.'),
}).strict();

export const ingestReplySchema = z.object({
  accepted: z.number().int(),
  duplicates: z.number().int(),
  state: z.enum(['steady', 'thin', 'short', 'dark', 'silent', 'new']),
  next_report_s: z.number().int(),
});

export type ReadingInput = z.infer<typeof readingSchema>;

export const CSV_FIELDS = ['t', 'v', 'seq', 'vp', 'temp', 'rssi'] as const;
