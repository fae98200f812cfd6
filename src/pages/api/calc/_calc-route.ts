/**
 * Shared plumbing for the calculator routes: no sign-in, parse the query with its schema, run the
 * pure math, answer JSON. A RangeError from the math is a refusal meant for the person (it carries
 * an actionable sentence), so it becomes a 400 like a failed schema; nothing else is expected.
 */
import type { APIRoute } from 'astro';
import type { z } from 'zod';
import { HttpError, handle, json, parseWith, searchParamsObject } from '~/server/http';

/** Pure answers: a shared cache may keep them briefly. */
const CACHEABLE = { 'cache-control': 'public, max-age=300' };

/** The first schema issue as the answer, without rewording: every calculator message names its parameter. */
export function parseCalc<S extends z.ZodType>(schema: S, input: unknown): z.infer<S> {
  return parseWith(schema, input, { asWritten: true });
}

/** Runs the math; its RangeErrors become 400s with their own message. */
export function refuseRangeErrors<T>(work: () => T): T {
  try {
    return work();
  } catch (err) {
    if (err instanceof RangeError) throw new HttpError(400, err.message);
    throw err;
  }
}

/** A GET calculator: query → schema → math → JSON. */
export function calcGet<S extends z.ZodType>(schema: S, work: (input: z.infer<S>) => unknown): APIRoute {
  return ({ url }) =>
    handle(() => {
      const input = parseCalc(schema, searchParamsObject(url));
      return json(refuseRangeErrors(() => work(input)), 200, CACHEABLE);
    });
}
