/** SWR's fetcher: JSON on success; on failure an Error carrying the server's message and status. */
export class FetchError extends Error {
  constructor(message: string, readonly status: number) {
    super(message);
    this.name = 'FetchError';
  }
}

export async function fetchJson<T>(url: string): Promise<T> {
  const response = await fetch(url, { headers: { accept: 'application/json' } });
  if (!response.ok) {
    const body = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
    throw new FetchError(body?.error?.message ?? `The server answered ${response.status}.`, response.status);
  }
  return (await response.json()) as T;
}
