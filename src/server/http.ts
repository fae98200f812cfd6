import type { z } from 'zod';

/**
 * An error that becomes an HTTP answer. Handlers throw it from guard clauses;
 * `handle()` turns it into `{error, field?}` JSON so no bad input ever reaches a 500.
 */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly field?: string,
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
  }
}

/** A JSON answer; `json<SomeAnswer<Date>>(…)` checks it against the shape the islands read (~/lib/api-types). */
export function json<T = unknown>(data: T, status = 200, headers: HeadersInit = {}): Response {
  return new Response(JSON.stringify(data), {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers },
  });
}

export function errorResponse(err: HttpError): Response {
  return json({ error: err.message, ...(err.field ? { field: err.field } : {}), ...(err.extra ?? {}) }, err.status);
}

/** Runs a handler body; HttpErrors become their answer, anything else a logged 500 without internals. */
export async function handle(work: () => Promise<Response> | Response): Promise<Response> {
  try {
    return await work();
  } catch (err) {
    if (err instanceof HttpError) return errorResponse(err);
    console.error('[throwline] unhandled error', err);
    return json({ error: 'Something went wrong on the server. Nothing was changed; try again.' }, 500);
  }
}

export interface ParseOptions {
  /**
   * Answer the schema's sentence exactly as written. Otherwise a sentence that does not name its
   * field gets the field put in front ("title: …"), so the person knows which input it means.
   */
  asWritten?: boolean;
}

/** The first zod issue, as a sentence a person can act on, with the field it concerns. */
export function zodToHttpError(error: z.ZodError, { asWritten = false }: ParseOptions = {}): HttpError {
  const issue = error.issues[0];
  const field = issue?.path.length ? issue.path.map(String).join('.') : undefined;
  const message = issue?.message ?? 'The request is not valid.';
  const named = asWritten || !field || message.toLowerCase().includes(field.split('.').pop()!.toLowerCase());
  return new HttpError(400, named ? message : `${field}: ${message}`, field);
}

/** The parsed input, or a 400 with the first issue's sentence: the one way a route refuses bad input. */
export function parseWith<S extends z.ZodType>(schema: S, input: unknown, options: ParseOptions = {}): z.infer<S> {
  const result = schema.safeParse(input);
  if (!result.success) throw zodToHttpError(result.error, options);
  return result.data;
}

/** Query parameters as a plain object; a repeated key keeps its last value. */
export function searchParamsObject(url: URL): Record<string, string> {
  return Object.fromEntries(url.searchParams.entries());
}

const IDEMPOTENCY_KEY = /^[A-Za-z0-9_.:-]{8,100}$/;

/**
 * The request's `Idempotency-Key` header (the IETF HTTP draft's name), when it has one. A key
 * that could not have come from a client library (too short, too long, odd characters) is a 400.
 */
export function idempotencyKey(request: Request): string | undefined {
  const raw = request.headers.get('idempotency-key');
  if (raw === null) return undefined;
  const key = raw.trim().replace(/^"(.*)"$/, '$1');
  if (!IDEMPOTENCY_KEY.test(key)) {
    throw new HttpError(400, 'The Idempotency-Key header must be 8 to 100 letters, digits or "-_.:" (a random UUID is ideal).', 'Idempotency-Key');
  }
  return key;
}

const MAX_JSON_BYTES = 2 * 1024 * 1024;

/**
 * Reads a JSON body with a size cap and a content-type check, before any parsing.
 * Text that is not JSON, or JSON sent as text/plain, is a 400 that says what to send instead.
 */
export async function readJsonBody(request: Request, maxBytes = MAX_JSON_BYTES): Promise<unknown> {
  const type = request.headers.get('content-type') ?? '';
  if (!/^application\/json\b/i.test(type)) {
    throw new HttpError(415, 'Send the body as JSON with the header "Content-Type: application/json".');
  }
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > maxBytes) throw new HttpError(413, `The body is larger than ${Math.round(maxBytes / 1024)} KiB; send less.`);
  const text = await readTextCapped(request, maxBytes);
  if (text.trim() === '') throw new HttpError(400, 'The body is empty; send a JSON object.');
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch {
    throw new HttpError(400, 'The body is not valid JSON; check quotes, commas and brackets.');
  }
  if (hasForbiddenKey(parsed)) {
    throw new HttpError(400, 'The body uses a reserved key name (__proto__, constructor or prototype); rename or remove it.');
  }
  return parsed;
}

const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

/** Iterative so a hostile 10,000-deep body cannot overflow the stack. */
function hasForbiddenKey(root: unknown): boolean {
  const stack: unknown[] = [root];
  while (stack.length) {
    const node = stack.pop();
    if (node === null || typeof node !== 'object') continue;
    if (Array.isArray(node)) {
      for (const item of node) stack.push(item);
      continue;
    }
    for (const key of Object.keys(node)) {
      if (FORBIDDEN_KEYS.has(key)) return true;
      stack.push((node as Record<string, unknown>)[key]);
    }
  }
  return false;
}

async function readTextCapped(request: Request, maxBytes: number): Promise<string> {
  if (!request.body) return '';
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw new HttpError(413, `The body is larger than ${Math.round(maxBytes / 1024)} KiB; send less.`);
    }
    chunks.push(value);
  }
  return new TextDecoder('utf-8', { fatal: false }).decode(Buffer.concat(chunks));
}
