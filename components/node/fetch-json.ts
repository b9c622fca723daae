/** GET a JSON reply of our API; a problem+json answer becomes an Error carrying its status and words. */
export class ApiError extends Error {
  constructor(public status: number, message: string) {
    super(message);
  }
}

export async function fetchJson<T>(path: string, signal?: AbortSignal): Promise<T> {
  const res = await fetch(path, { credentials: 'same-origin', signal, headers: { accept: 'application/json' } });
  if (!res.ok) {
    const problem = (await res.json().catch(() => null)) as { detail?: string; title?: string } | null;
    throw new ApiError(res.status, problem?.detail ?? problem?.title ?? `The server answered ${res.status}.`);
  }
  return (await res.json()) as T;
}
