// Browser-side JSON calls to our route handlers; errors carry the server's message.
export class ApiError extends Error {
  constructor(
    public status: number,
    message: string,
    public issues?: unknown,
  ) {
    super(message);
  }
}

/** The server's message for a failed call, or `fallback` for anything else (a lost connection, a bug). */
export function messageOf(err: unknown, fallback: string): string {
  return err instanceof ApiError ? err.message : fallback;
}

export async function api<T>(url: string, init?: RequestInit & { json?: unknown }): Promise<T> {
  const { json, ...rest } = init ?? {};
  const res = await fetch(url, {
    ...rest,
    headers: { ...(json !== undefined ? { 'content-type': 'application/json' } : {}), ...rest.headers },
    body: json !== undefined ? JSON.stringify(json) : rest.body,
  });
  if (res.status === 204) return undefined as T;
  const body = (await res.json().catch(() => ({}))) as { error?: string; issues?: unknown };
  if (!res.ok) {
    const fallback =
      res.status === 401
        ? 'Your session ended. Sign in again.'
        : res.status === 403
          ? 'Your role does not allow this.'
          : `Request failed (${res.status}).`;
    throw new ApiError(res.status, body.error ?? fallback, body.issues);
  }
  return body as T;
}

export const fetcher = <T>(url: string) => api<T>(url);
