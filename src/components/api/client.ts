import type { ApiErrorBody } from '~/lib/api-types';

/**
 * Every refusal an island can meet, in the server's own shape: `error` is the sentence to show,
 * `field` the input at fault, `body` the whole answer for the few that carry more (a 409's
 * `current` or `usedBy`). Status 0 means the server was not reached or the request was cancelled.
 */
export class ApiError extends Error {
  readonly error: string;
  constructor(
    readonly status: number,
    error: string,
    readonly field?: string,
    readonly body: Record<string, unknown> = {},
  ) {
    super(error);
    this.name = 'ApiError';
    this.error = error;
  }
}

/** Status of an ApiError for "never reached the server". */
export const UNREACHABLE = 0;

const UNREACHABLE_SENTENCE = 'Could not reach Throwline. Check the connection and try again.';

/** A sentence, or one built from the HTTP status. */
export type Fallback = string | ((status: number) => string);

/**
 * The ApiError for an answer that is not a success, whatever arrived: the server's sentence when
 * the body is `{error, field?}`, else `fallback` (which may mention the status).
 */
export function apiErrorFrom(status: number, body: unknown, fallback: Fallback = (s) => `The server answered ${s}.`): ApiError {
  const answer = body && typeof body === 'object' ? (body as Partial<ApiErrorBody> & Record<string, unknown>) : {};
  const error = typeof answer.error === 'string' && answer.error ? answer.error : typeof fallback === 'function' ? fallback(status) : fallback;
  const field = typeof answer.field === 'string' ? answer.field : undefined;
  return new ApiError(status, error, field, answer);
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** Sent as JSON. */
  body?: unknown;
  signal?: AbortSignal;
  /** What to say when the server answers an error without a sentence of its own. */
  fallback?: Fallback;
  /** What to say when the server is not reached (offline, DNS, cancelled). */
  unreachable?: string;
  /** Extra request headers (e.g. Idempotency-Key). */
  headers?: Record<string, string>;
  /** Try once more at once when the server was not reached: only safe for idempotent requests. */
  retryUnreachable?: boolean;
}

/**
 * One JSON request to Throwline's own API. Same-origin with the session cookie; the browser adds
 * the Origin header that the server checks on every write. Resolves with the parsed answer
 * (`undefined` for a 204); rejects with an ApiError and nothing else.
 */
export async function request<T>(url: string, options: RequestOptions = {}): Promise<T> {
  const { method = 'GET', body, signal } = options;
  const headers: Record<string, string> = { accept: 'application/json', ...options.headers };
  if (body !== undefined) headers['content-type'] = 'application/json';
  const init: RequestInit = { method, headers, body: body === undefined ? undefined : JSON.stringify(body), credentials: 'same-origin', signal };
  let res: Response;
  try {
    res = await fetch(url, init).catch((err: unknown) => {
      if (!options.retryUnreachable || signal?.aborted) throw err;
      return fetch(url, init);
    });
  } catch {
    throw new ApiError(UNREACHABLE, options.unreachable ?? UNREACHABLE_SENTENCE);
  }
  const answer: unknown = res.status === 204 ? undefined : await res.json().catch(() => undefined);
  if (!res.ok) throw apiErrorFrom(res.status, answer, options.fallback);
  return answer as T;
}

/** The one SWR fetcher: `useSWR<SomeAnswer, ApiError>(key, fetcher)`. */
export function fetcher<T>(url: string): Promise<T> {
  return request<T>(url);
}

/** `/api/venues/<venue>`, with the slug encoded; the feature modules build on it. */
export function venueApi(venue: string): string {
  return `/api/venues/${encodeURIComponent(venue)}`;
}
