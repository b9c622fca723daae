import 'server-only';
import type { z } from 'zod';
import { assertSameOrigin, requireMemberships, type Member, type OrgChoice } from '../auth/guard';
import type { Permission } from '../auth/roles';
import { pointersFromZod, problemResponse, problems } from '../errors';

/**
 * A route handler in the fixed order: authenticate → check role (and Origin for writes) →
 * parse the body with its zod schema → act. Errors leave as RFC 9457 problem+json.
 */
type Params = Record<string, string | string[]>;

export function memberRoute<S extends z.ZodType | undefined, P extends Params = Params>(
  opts: { permission: Permission; body?: S },
  act: (ctx: { member: Member; organizations: OrgChoice[]; body: S extends z.ZodType ? z.infer<S> : undefined; params: P; request: Request }) => Promise<Response>,
) {
  return async (request: Request, context: { params: Promise<P> }): Promise<Response> => {
    try {
      const { member, organizations } = await requireMemberships(opts.permission);
      assertSameOrigin(request);
      let body: unknown = undefined;
      if (opts.body) body = await parseJsonBody(request, opts.body);
      return await act({ member, organizations, body: body as never, params: await context.params, request });
    } catch (error) {
      return problemResponse(error);
    }
  };
}

export async function parseJsonBody<S extends z.ZodType>(request: Request, schema: S): Promise<z.infer<S>> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('application/json')) throw problems.unsupportedMedia('Send application/json.');
  const text = await request.text();
  if (text.length > 1_000_000) throw problems.tooLarge('The body is over 1 MB.');
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw problems.badRequest('The body is not valid JSON.');
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw problems.invalid(pointersFromZod(parsed.error));
  return parsed.data;
}

/** Route ids are positive integers; anything else is simply not found. */
export function idParam(value: string | string[] | undefined, what: string): number {
  const id = Number(Array.isArray(value) ? value[0] : value);
  if (!Number.isSafeInteger(id) || id <= 0 || String(id) !== String(value)) throw problems.notFound(what);
  return id;
}

/** A route open to signed-out callers (invitation accept, password reset): still Origin-checked and parsed. */
export function publicRoute<S extends z.ZodType>(
  opts: { body: S },
  act: (ctx: { body: z.infer<S>; request: Request }) => Promise<Response>,
) {
  return async (request: Request): Promise<Response> => {
    try {
      assertSameOrigin(request);
      const body = await parseJsonBody(request, opts.body);
      return await act({ body, request });
    } catch (error) {
      return problemResponse(error);
    }
  };
}
