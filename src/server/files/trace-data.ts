/**
 * Parsed traces for drawing, read from their compact stored form. The stored names derive from
 * the content, so a name's bytes never change: a small cache keyed by name cannot go stale, and
 * a trace drawn on many pages is read from disk once.
 */
import { readFile } from 'node:fs/promises';
import { and, eq, inArray } from 'drizzle-orm';
import { files } from '~/db/schema';
import { decodeTrace } from '~/lib/traces/trace-storage';
import type { Trace } from '~/lib/traces/parse-trace';
import { getDb } from '~/server/db';
import { storedPath } from './storage-paths';
import { TRACE_MIME } from './read-trace-upload';

const CACHE_LIMIT = 64;
const cache = new Map<string, Trace>();

async function readStored(name: string): Promise<Trace | null> {
  const hit = cache.get(name);
  if (hit) {
    cache.delete(name);
    cache.set(name, hit);
    return hit;
  }
  try {
    const trace = decodeTrace(await readFile(storedPath(name), 'utf8'));
    cache.set(name, trace);
    if (cache.size > CACHE_LIMIT) cache.delete(cache.keys().next().value!);
    return trace;
  } catch {
    // Missing or damaged bytes: the plot says the trace is unavailable instead of failing the page.
    return null;
  }
}

export interface LoadedTrace {
  trace: Trace;
  originalName: string;
}

/** The traces among `fileIds` that belong to `venueId`; ids of other venues or kinds are absent. */
export async function loadVenueTraces(venueId: string, fileIds: readonly string[]): Promise<Map<string, LoadedTrace>> {
  const out = new Map<string, LoadedTrace>();
  if (fileIds.length === 0) return out;
  const db = await getDb();
  const rows = await db
    .select({ id: files.id, displayName: files.displayName, originalName: files.originalName })
    .from(files)
    .where(and(eq(files.venueId, venueId), eq(files.mime, TRACE_MIME), inArray(files.id, [...new Set(fileIds)])));
  for (const row of rows) {
    if (!row.displayName) continue;
    const trace = await readStored(row.displayName);
    if (trace) out.set(row.id, { trace, originalName: row.originalName });
  }
  return out;
}
