/**
 * Measured traces drawn over a block's computed curve, and their table. The trace data is looked
 * up by file id in what the caller loaded (the renderer itself reads no files); a trace whose file
 * is gone is listed as unavailable, never silently dropped.
 */
import { escapeHtml } from '~/lib/doc/escape-html';
import type { PlotCurve } from '~/lib/plot/response-svg';
import type { Trace } from '~/lib/traces/parse-trace';
import { binForPlot } from '~/lib/traces/plot-bins';
import { smoothMagnitudeDb } from '~/lib/traces/smooth-trace';
import { traceDifference } from '~/lib/traces/trace-difference';
import { traceOverlay } from '~/lib/traces/trace-overlay';
import { blockTraces, type TraceCompare, type TraceRef } from './block-data';
import { fixed } from './block-format';

export interface TraceData {
  trace: Trace;
  originalName: string;
}
export type TraceLookup = ReadonlyMap<string, TraceData>;

const e = (text: string) => escapeHtml(text);

function traceName(ref: TraceRef, i: number): string {
  return ref.label || `Trace ${i + 1}`;
}

/** The trace as drawn: smoothed (on the full resolution) and moved by its offset. */
function aligned(ref: TraceRef, data: TraceData): { freqHz: number[]; magnitudeDb: number[] } {
  const smoothed = ref.smoothing ? smoothMagnitudeDb(data.trace.freqHz, data.trace.magnitudeDb, ref.smoothing) : data.trace.magnitudeDb;
  return { freqHz: data.trace.freqHz, magnitudeDb: smoothed.map((v) => v + ref.offsetDb) };
}

/** Plot curves for a block's traces (strong and faint parts) and, when set, the difference of two. */
export function traceCurves(attrs: { traces?: TraceRef[]; compare?: TraceCompare | null }, lookup: TraceLookup | undefined): { curves: PlotCurve[]; difference: PlotCurve | null } {
  const curves: PlotCurve[] = [];
  if (!lookup) return { curves, difference: null };
  blockTraces(attrs).forEach((ref, i) => {
    const data = lookup.get(ref.fileId);
    if (!data) return;
    const o = traceOverlay(data.trace, { offsetDb: ref.offsetDb, smoothing: ref.smoothing });
    const variant = `tl-trace-${(i % 4) + 1}`;
    curves.push({ role: 'trace-faint', freqs: o.freqs, values: o.faint, className: variant });
    curves.push({ role: 'trace', freqs: o.freqs, values: o.strong, label: traceName(ref, i), className: variant });
  });
  let difference: PlotCurve | null = null;
  const c = attrs.compare;
  const refs = blockTraces(attrs);
  const before = c && refs.find((r) => r.fileId === c.before);
  const after = c && refs.find((r) => r.fileId === c.after);
  const beforeData = before && lookup.get(before.fileId);
  const afterData = after && lookup.get(after.fileId);
  if (before && after && beforeData && afterData) {
    const diff = traceDifference(aligned(after, afterData), aligned(before, beforeData));
    if (diff.freqHz.length >= 2) {
      const pts = binForPlot(diff, 20, 20_000, 480);
      difference = { role: 'difference', freqs: pts.map((p) => p.hz), values: pts.map((p) => p.db), label: `${traceName(after, refs.indexOf(after))} − ${traceName(before, refs.indexOf(before))}` };
    }
  }
  return { curves, difference };
}

/** The table of attached traces with their notes and download links; empty when there are none. */
export function traceTable(attrs: { traces?: TraceRef[]; compare?: TraceCompare | null }, lookup: TraceLookup | undefined, fileUrl = (id: string) => `/files/${id}`): string {
  const refs = blockTraces(attrs);
  if (refs.length === 0) return '';
  const rows = refs
    .map((ref, i) => {
      const data = lookup?.get(ref.fileId);
      const smoothing = ref.smoothing ? `1/${ref.smoothing} oct` : 'none';
      const file = data
        ? `<a href="${e(fileUrl(ref.fileId))}?download=1" download>${e(data.originalName)}</a> (${data.trace.freqHz.length.toLocaleString('en')} points)`
        : 'unavailable: the file was removed';
      return `<tr><th scope="row">${e(traceName(ref, i))}</th><td>${e(ref.date) || '—'}</td><td>${e(ref.position) || '—'}</td><td class="num">${fixed(ref.offsetDb, 1)}</td><td>${smoothing}</td><td>${file}</td></tr>`;
    })
    .join('');
  const faint = '<p class="tl-block-note">Faint stretches of a trace are where its coherence is below 0.5: read them with caution.</p>';
  return `<div class="tl-values" tabindex="0" role="region" aria-label="Measured traces"><table><caption>Measured traces</caption><thead><tr><th scope="col">Trace</th><th scope="col">Date</th><th scope="col">Position</th><th scope="col" class="num">Offset (dB)</th><th scope="col">Smoothing</th><th scope="col">File</th></tr></thead><tbody>${rows}</tbody></table></div>${faint}`;
}
