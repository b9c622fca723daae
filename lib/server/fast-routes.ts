import type { IncomingMessage, ServerResponse } from 'node:http';
import { problemResponse } from '../errors';
import { ingestReply } from '../ingest/ingest';

/**
 * The device ingest route served straight from the Node server, ahead of Next's router: the
 * same handler as app/api/v1/readings/route.ts (lib/ingest/ingest.ts), without the page
 * machinery around it, because devices post far more often than people click.
 */
const HEADERS = { 'x-content-type-options': 'nosniff', 'referrer-policy': 'strict-origin-when-cross-origin', 'cache-control': 'no-store' };

export function isFastRoute(req: IncomingMessage): boolean {
  return req.method === 'POST' && (req.url ?? '').split('?')[0] === '/api/v1/readings';
}

export async function serveFastRoute(req: IncomingMessage, res: ServerResponse): Promise<void> {
  try {
    // No web Request or Response is built: ingest reads two headers and the body, straight
    // from Node's, and a 200 is written directly (a refusal goes through problemResponse).
    const reply = JSON.stringify(await ingestReply({ headers: { get: (name) => headerOf(req, name) }, body: req }));
    res.writeHead(200, { ...HEADERS, 'content-type': 'application/json', 'content-length': String(Buffer.byteLength(reply)) });
    res.end(reply);
    return;
  } catch (error) {
    const response = problemResponse(error);
    const body = Buffer.from(await response.arrayBuffer());
    const out: Record<string, string> = { ...HEADERS, 'content-length': String(body.length) };
    response.headers.forEach((value, name) => { out[name] = value; });
    res.writeHead(response.status, out);
    res.end(body);
  }
}

function headerOf(req: IncomingMessage, name: string): string | null {
  const value = req.headers[name.toLowerCase()];
  if (value === undefined) return null;
  return Array.isArray(value) ? value.join(', ') : value;
}
