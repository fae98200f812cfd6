import type { APIRoute } from 'astro';
import { cascadeResponse, logFrequencyGrid } from '~/lib/acoustics';
import { ResponseBodySchema } from '~/lib/schemas/calc';
import { handle, json, readJsonBody } from '~/server/http';
import { parseCalc, refuseRangeErrors } from './_calc-route';

/** Default grid points: smooth on a phone-width plot, small to send. */
const DEFAULT_POINTS = 256;

/** Magnitude and phase of a filter chain, by default on a log grid from 10 Hz to 24 kHz (or Nyquist). */
export const POST: APIRoute = ({ request }) =>
  handle(async () => {
    const body = parseCalc(ResponseBodySchema, await readJsonBody(request));
    return json(
      refuseRangeErrors(() => {
        const freqs = body.freqs ?? logFrequencyGrid(10, Math.min(24_000, body.sampleRate / 2), DEFAULT_POINTS);
        return { sampleRate: body.sampleRate, ...cascadeResponse(body.filters, freqs, body.sampleRate) };
      }),
    );
  });
