import type { ZodError } from 'zod';

/**
 * The one error type of the app: it knows its HTTP status and renders RFC 9457
 * application/problem+json. Anything else thrown is logged and answered as a bare 500.
 */
export interface InvalidParam {
  pointer: string; // RFC 6901 JSON pointer into the request body
  detail: string;
}

export class ProblemError extends Error {
  constructor(
    public status: number,
    public title: string,
    public detail?: string,
    public extra: { errors?: InvalidParam[]; headers?: Record<string, string>; [key: string]: unknown } = {},
  ) {
    super(detail ?? title);
  }

  toResponse(): Response {
    const { headers, ...members } = this.extra;
    const body = { type: 'about:blank', title: this.title, status: this.status, ...(this.detail ? { detail: this.detail } : {}), ...members };
    return new Response(JSON.stringify(body), {
      status: this.status,
      headers: { 'content-type': 'application/problem+json', 'cache-control': 'no-store', ...(headers ?? {}) },
    });
  }
}

export const problems = {
  badRequest: (detail: string) => new ProblemError(400, 'Malformed request', detail),
  unauthorized: (detail = 'Sign in first.') => new ProblemError(401, 'Not signed in', detail),
  forbidden: (detail = 'Your role does not allow this.') => new ProblemError(403, 'Not allowed', detail),
  notFound: (what = 'The resource') => new ProblemError(404, 'Not found', `${what} does not exist.`),
  conflict: (detail: string) => new ProblemError(409, 'Conflict', detail),
  unsupportedMedia: (detail: string) => new ProblemError(415, 'Unsupported media type', detail),
  tooLarge: (detail: string) => new ProblemError(413, 'Request too large', detail),
  tooMany: (retryAfterSeconds: number) =>
    new ProblemError(429, 'Too many requests', `Slow down; retry after ${retryAfterSeconds} s.`, { headers: { 'retry-after': String(retryAfterSeconds) } }),
  unavailable: (retryAfterSeconds = 5) =>
    new ProblemError(503, 'Storage unavailable', 'Nothing was stored; retry later.', { headers: { 'retry-after': String(retryAfterSeconds) } }),
  invalid: (errors: InvalidParam[], detail = 'Some values are not valid.') => new ProblemError(422, 'Invalid values', detail, { errors }),
};

/** zod issues → one pointer per bad field, in the server's words. */
export function pointersFromZod(error: ZodError, prefix = ''): InvalidParam[] {
  return error.issues.map((issue) => ({
    pointer: prefix + (issue.path.length ? '/' + issue.path.map((p) => String(p).replace(/~/g, '~0').replace(/\//g, '~1')).join('/') : ''),
    detail: plainWords(issue),
  }));
}

type Issue = ZodError['issues'][number];

/**
 * A range check written without its own message gets zod's default ("Too small: expected
 * number to be >=1"), which reads like a stack trace on a form. Those become plain words;
 * every message a schema wrote itself is kept as it is.
 */
function plainWords(issue: Issue): string {
  const { message } = issue;
  if (issue.code === 'too_small' && message.startsWith('Too small')) {
    const min = Number(issue.minimum);
    if (issue.origin === 'string') return `At least ${min} character${min === 1 ? '' : 's'}.`;
    if (issue.origin === 'array') return `At least ${min} item${min === 1 ? '' : 's'}.`;
    return issue.inclusive === false ? `Must be above ${min}.` : `Must be at least ${min}.`;
  }
  if (issue.code === 'too_big' && message.startsWith('Too big')) {
    const max = Number(issue.maximum);
    if (issue.origin === 'string') return `At most ${max} character${max === 1 ? '' : 's'}.`;
    if (issue.origin === 'array') return `At most ${max} item${max === 1 ? '' : 's'}.`;
    return issue.inclusive === false ? `Must be below ${max}.` : `Must be at most ${max}.`;
  }
  return message;
}

export function problemResponse(error: unknown): Response {
  if (error instanceof ProblemError) return error.toResponse();
  console.error('[error]', error);
  return new ProblemError(500, 'Internal error', 'Something went wrong on our side; nothing was changed.').toResponse();
}
