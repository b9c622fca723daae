import { z } from 'zod';

/** A field visit as the visit form sends it (multipart fields) and the API checks it. */
export const MAX_PHOTO_BYTES = 5 * 1_048_576;

export const visitFields = z.object({
  visited_on: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter the date as YYYY-MM-DD.').refine(isRealDate, 'Not a real date.').refine(notInFuture, 'The visit cannot be in the future.'),
  work_done: z.string().trim().min(1, 'Say what was done.').max(4000, 'Keep it under 4000 characters.'),
}).strict();

export type VisitFields = z.infer<typeof visitFields>;

export interface VisitWire {
  id: number;
  visited_on: string;
  work_done: string;
  by: string | null;
  has_photo: boolean;
  created_at: string;
}

function isRealDate(value: string): boolean {
  const d = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === value;
}

// A day of slack: the visitor's local date can be a day ahead of UTC.
function notInFuture(value: string): boolean {
  return new Date(`${value}T00:00:00Z`).getTime() <= Date.now() + 86_400_000;
}

/**
 * The photo's type from its first bytes, never from its name or the browser's claim:
 * PNG signature (ISO/IEC 15948 / RFC 2083 §3.1) and JPEG SOI marker FF D8 FF (ITU-T T.81).
 */
export function sniffImageType(head: Uint8Array): 'image/png' | 'image/jpeg' | null {
  const png = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  if (head.length >= 8 && png.every((b, i) => head[i] === b)) return 'image/png';
  if (head.length >= 3 && head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff) return 'image/jpeg';
  return null;
}
