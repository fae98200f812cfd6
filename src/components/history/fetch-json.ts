/** SWR fetcher: JSON on success; on failure an Error carrying the server's sentence and status. */
export class FetchError extends Error {
  constructor(
    message: string,
    readonly status: number,
  ) {
    super(message);
  }
}

export async function fetchJson<T>(url: string): Promise<T> {
  const res = await fetch(url, { headers: { accept: 'application/json' } });
  const body = await res.json().catch(() => ({}));
  if (!res.ok) throw new FetchError(body.error ?? `The server answered ${res.status}.`, res.status);
  return body as T;
}
