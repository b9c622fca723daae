/** Browser-side calls to our API; problem+json answers come back as field errors. */
export interface Problem {
  title: string;
  status: number;
  detail?: string;
  errors?: { pointer: string; detail: string }[];
}

export type ApiResult<T> = { ok: true; data: T } | { ok: false; problem: Problem };

export async function apiFetch<T = unknown>(path: string, init: { method?: string; body?: unknown } = {}): Promise<ApiResult<T>> {
  let res: Response;
  try {
    res = await fetch(path, {
      method: init.method ?? 'GET',
      headers: init.body === undefined ? undefined : { 'content-type': 'application/json' },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      credentials: 'same-origin',
    });
  } catch {
    return { ok: false, problem: { title: 'Network error', status: 0, detail: 'The server could not be reached. Check the connection and try again.' } };
  }
  if (res.status === 204) return { ok: true, data: undefined as T };
  const body = await res.json().catch(() => null);
  if (res.ok) return { ok: true, data: body as T };
  return { ok: false, problem: (body as Problem) ?? { title: res.statusText, status: res.status } };
}

/**
 * A server message about a field the form shows in its own unit (µA, mA, mΩ, a % field sent
 * as a fraction): "Must be at most 1." becomes "Must be at most 100 %.", "Must be at most 10 A."
 * on a mA field "Must be at most 10000 mA.", and a limit without a unit gets the field's. Any
 * other message is kept.
 */
export function inFieldUnits(message: string, { scale, unit }: { scale: number; unit: string }): string {
  const withUnit = (n: number) => `${Number(n.toPrecision(12))}${unit ? (unit.startsWith('°') ? unit : ` ${unit}`) : ''}`;
  if (/^Enter a number \(.*\)\.$/.test(message)) return unit ? `Enter a number (${unit}).` : message;
  return message.replace(/^(Must be (?:at most|at least|above|below)) (-?\d+(?:\.\d+)?)(?: [^\s\d][^\s]*)?\.$/, (_, words: string, n: string) => `${words} ${withUnit(Number(n) / scale)}.`);
}

/** Errors by field name (the last pointer segment joined with dots), plus a general message. */
export function fieldErrors(problem: Problem): Record<string, string> {
  const out: Record<string, string> = {};
  for (const e of problem.errors ?? []) out[e.pointer.replace(/^\//, '').replace(/\//g, '.') || '_'] = e.detail;
  return out;
}
