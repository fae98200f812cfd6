/**
 * A measurement trace arriving through the upload pipeline: the bytes must be UTF-8 text that
 * the trace parser reads completely. Kept beside the image and PDF steps so every file, whatever
 * its kind, passes the same streaming cap, temp-file and durable-publish path.
 */
import { readFile } from 'node:fs/promises';
import { parseTrace, TraceParseError, type Trace } from '~/lib/traces/parse-trace';
import { encodeTrace } from '~/lib/traces/trace-storage';
import { HttpError } from '~/server/http';

export const TRACE_MIME = 'text/plain; charset=utf-8';

/** The parsed trace and its compact stored form, or a 415/422 that names what is wrong. */
export async function readTraceUpload(path: string, notAccepted: string): Promise<{ trace: Trace; compact: Buffer }> {
  const bytes = await readFile(path);
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new HttpError(415, `${notAccepted}. Export it as JPEG or PDF, or a measurement as plain-text columns, and upload it again.`, 'file');
  }
  try {
    const trace = parseTrace(text.replace(/^\uFEFF/, ''));
    return { trace, compact: Buffer.from(encodeTrace(trace)) };
  } catch (err) {
    if (!(err instanceof TraceParseError)) throw err;
    // Text with no numbers at all is not a measurement someone meant to send: say what we take.
    if (err.noData) throw new HttpError(415, `${notAccepted}: it is text, but holds no columns of frequency and magnitude. Throwline takes photos, PDFs and measurement traces.`, 'file');
    throw new HttpError(422, `This measurement could not be read. ${err.message}`, 'file');
  }
}
