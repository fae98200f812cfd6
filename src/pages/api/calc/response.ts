import type { APIRoute } from 'astro';
import { RESPONSE_FLOOR_DB, cascadeResponse, logFrequencyGrid, waysResponse } from '~/lib/acoustics';
import { ResponseBodySchema } from '~/lib/schemas/calc-response';
import { describePath } from '~/lib/schemas/processor-blocks';
import { HttpError, handle, json, readJsonBody } from '~/server/http';
import { parseCalc, refuseRangeErrors } from './_calc-route';

/** Default grid points: smooth on a phone-width plot, small to send. */
const DEFAULT_POINTS = 256;

/** A way's problem arrives from the shared block schema as a bare predicate; name the way and the field. */
function parseBody(input: unknown) {
  const result = ResponseBodySchema.safeParse(input);
  const issue = result.success ? undefined : result.error.issues[0];
  if (issue && issue.path[0] === 'ways' && issue.message.startsWith('must')) {
    const where = describePath(issue.path);
    throw new HttpError(400, `${where.charAt(0).toUpperCase()}${where.slice(1)} ${issue.message}.`, issue.path.map(String).join('.'));
  }
  return parseCalc(ResponseBodySchema, input);
}

/**
 * Magnitude and phase of a filter chain, by default on a log grid from 10 Hz to 24 kHz (or Nyquist);
 * with `ways`, also each crossover way (gain, polarity and delay included) and their electrical sum.
 * Phase is null where the magnitude is at its floor: there is no signal to have a phase.
 */
export const POST: APIRoute = ({ request }) =>
  handle(async () => {
    const body = parseBody(await readJsonBody(request));
    return json(
      refuseRangeErrors(() => {
        const freqs = body.freqs ?? logFrequencyGrid(10, Math.min(24_000, body.sampleRate / 2), DEFAULT_POINTS);
        const chain = cascadeResponse(body.filters, freqs, body.sampleRate);
        const phaseDeg = chain.phaseDeg.map((p, i) => (chain.magnitudeDb[i]! <= RESPONSE_FLOOR_DB ? null : p));
        const answer: Record<string, unknown> = { sampleRate: body.sampleRate, ...chain, phaseDeg };
        if (body.ways?.length) {
          const r = waysResponse(body.ways, freqs, body.sampleRate);
          answer.ways = r.ways.map((w) => ({ magnitudeDb: w.magnitudeDb, phaseDeg: w.phaseDeg }));
          answer.sum = { magnitudeDb: r.sum.magnitudeDb, phaseDeg: r.sum.phaseDeg };
        }
        return answer;
      }),
    );
  });
