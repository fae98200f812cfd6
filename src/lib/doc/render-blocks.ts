/**
 * Read-view HTML for the processor blocks: an SVG plot drawn on the server (no client script) and
 * a table of the values, with captions for screen readers and print. Called from renderDocHtml.
 */
import { escapeHtml } from './escape-html';
import type { BlockRenderer } from './render-html';
import type { PmNode } from './types';
import { responseSvg, type PlotCurve } from '~/lib/plot/response-svg';
import {
  BAND_TYPE_LABELS,
  CROSSOVER_BLOCK,
  DELAY_BLOCK,
  EQ_BLOCK,
  hasGain,
  isShelf,
  type CrossoverBlockAttrs,
  type DelayBlockAttrs,
  type EqBlockAttrs,
} from './blocks/block-data';
import { bandWidths, crossoverCurves, delayResult, eqCurves, type EqCurves } from './blocks/block-curves';
import { bandSummary, familyLabel, fixed, hz, num, rateLabel, signedDb } from './blocks/block-format';

const e = (text: string) => escapeHtml(text);

export const Q_CONVENTION = 'Q per the Audio EQ Cookbook: width between the half-gain points of the analog prototype.';

function title(kind: string, label: string): string {
  return `<h3 class="tl-block-title">${e(kind)}${label ? ` · ${e(label)}` : ''}</h3>`;
}

function note(text: string): string {
  return text ? `<p class="tl-block-note">${e(text).replace(/\n/g, '<br/>')}</p>` : '';
}

function figure(svg: string, caption: string): string {
  return `<figure>${svg}<figcaption>${e(caption)}</figcaption></figure>`;
}

export function eqPlotSvg(block: EqBlockAttrs, idPrefix: string, compare?: EqBlockAttrs, computed?: EqCurves): string {
  const curves = computed ?? eqCurves(block);
  const magnitude: PlotCurve[] = [];
  if (compare) {
    const before = eqCurves(compare);
    magnitude.push({ role: 'before', freqs: before.freqs, values: before.total, label: 'Before' });
    magnitude.push({ role: 'after', freqs: curves.freqs, values: curves.total, label: 'After' });
  } else {
    for (const p of curves.parts) magnitude.push({ role: 'part', freqs: curves.freqs, values: p.values });
    for (const p of curves.prototypes) magnitude.push({ role: 'prototype', freqs: curves.freqs, values: p.values, label: `Band ${p.index + 1} analog prototype` });
    magnitude.push({ role: 'total', freqs: curves.freqs, values: curves.total, label: 'Total' });
  }
  return responseSvg({
    title: `${compare ? 'Before and after: ' : ''}EQ response${block.label ? `, ${block.label}` : ''}`,
    description: compare
      ? 'Magnitude of the EQ before the change (dashed) and after it (solid).'
      : `Magnitude of all ${block.bands.filter((b) => b.on).length} bands that are on together (bold), each band faint beneath, and phase below.`,
    magnitude,
    phase: compare ? undefined : [{ role: 'total', freqs: curves.freqs, values: curves.phase }],
    nyquistHz: block.sampleRate / 2,
    idPrefix,
  });
}

function renderEq(block: EqBlockAttrs, id: string): string {
  const rows = block.bands
    .map((band, i) => {
      const w = bandWidths(band, block.sampleRate);
      const width = w.nominalOctaves === null ? '—' : num(w.nominalOctaves, 2);
      const real = w.digitalOctaves === null ? '—' : num(w.digitalOctaves, 3);
      return `<tr${band.on ? '' : ' class="tl-off"'}><th scope="row">${i + 1}</th><td>${e(BAND_TYPE_LABELS[band.type])}</td><td class="num">${num(band.freq, 1)}</td><td class="num">${hasGain(band.type) ? fixed(band.gain, 1) : '—'}</td><td class="num">${isShelf(band.type) ? `S ${num(band.q)}` : num(band.q)}</td><td class="num">${width}</td><td class="num">${real}</td><td>${band.on ? 'on' : 'off'}</td></tr>`;
    })
    .join('');
  const curves = eqCurves(block);
  const prototypeNote = curves.prototypes.length
    ? ` Dashed: the analog prototype of band${curves.prototypes.length > 1 ? 's' : ''} ${curves.prototypes.map((p) => p.index + 1).join(', ')}, which the ${rateLabel(block.sampleRate)} biquad departs from near Nyquist.`
    : '';
  return [
    `<section class="tl-block tl-eq" aria-labelledby="${id}-h" data-block="${EQ_BLOCK}">`,
    `<div id="${id}-h">${title('EQ', block.label)}</div>`,
    figure(eqPlotSvg(block, id, undefined, curves), `${Q_CONVENTION}${prototypeNote}`),
    `<div class="tl-values"><table><caption>Bands at ${rateLabel(block.sampleRate)}</caption><thead><tr><th scope="col">#</th><th scope="col">Type</th><th scope="col" class="num">Freq (Hz)</th><th scope="col" class="num">Gain (dB)</th><th scope="col" class="num">Q / S</th><th scope="col" class="num">Width (oct)</th><th scope="col" class="num">Half-gain width at ${rateLabel(block.sampleRate)} (oct)</th><th scope="col">On</th></tr></thead><tbody>${rows || '<tr><td colspan="8">No bands.</td></tr>'}</tbody></table></div>`,
    `<p>Output gain ${signedDb(block.outputGain)}, polarity ${block.polarity}, sample rate ${rateLabel(block.sampleRate)}.</p>`,
    note(block.note),
    '</section>',
  ].join('');
}

export function crossoverPlotSvg(block: CrossoverBlockAttrs, idPrefix: string, compare?: CrossoverBlockAttrs): string {
  const c = crossoverCurves(block);
  const magnitude: PlotCurve[] = [];
  if (compare) {
    const before = crossoverCurves(compare);
    magnitude.push({ role: 'before', freqs: before.freqs, values: before.sum, label: 'Sum before' });
    magnitude.push({ role: 'after', freqs: c.freqs, values: c.sum, label: 'Sum after' });
  } else {
    c.ways.forEach((values, i) => magnitude.push({ role: 'total', freqs: c.freqs, values, label: block.ways[i]!.name || `Way ${i + 1}` }));
    magnitude.push({ role: 'sum', freqs: c.freqs, values: c.sum, label: 'Sum of the ways' });
  }
  return responseSvg({
    title: `${compare ? 'Before and after: ' : ''}Crossover${block.label ? `, ${block.label}` : ''}`,
    description: compare
      ? 'Electrical sum of the ways before the change (dashed) and after it (solid).'
      : 'Each way, and their electrical sum with polarity, gain and delay included; a notch in the sum is a polarity or delay problem.',
    magnitude,
    phase: compare ? undefined : [{ role: 'sum', freqs: c.freqs, values: c.sumPhase }],
    range: { top: 12, bottom: -36, step: 6 },
    nyquistHz: block.sampleRate / 2,
    idPrefix,
  });
}

function renderCrossover(block: CrossoverBlockAttrs, id: string): string {
  const rows = block.ways
    .map(
      (w, i) =>
        `<tr><th scope="row">${e(w.name || `Way ${i + 1}`)}</th><td>${w.highPass ? e(familyLabel(w.highPass)) : '—'}</td><td>${w.lowPass ? e(familyLabel(w.lowPass)) : '—'}</td><td class="num">${fixed(w.gain, 1)}</td><td>${w.polarity}</td><td class="num">${fixed(w.delayMs, 2)}</td></tr>`,
    )
    .join('');
  return [
    `<section class="tl-block tl-crossover" aria-labelledby="${id}-h" data-block="${CROSSOVER_BLOCK}">`,
    `<div id="${id}-h">${title('Crossover', block.label)}</div>`,
    figure(crossoverPlotSvg(block, id), 'Ways and their electrical sum, as if the drivers were at one point; the acoustic sum also depends on where they are.'),
    `<div class="tl-values"><table><caption>Ways at ${rateLabel(block.sampleRate)}</caption><thead><tr><th scope="col">Way</th><th scope="col">High-pass</th><th scope="col">Low-pass</th><th scope="col" class="num">Gain (dB)</th><th scope="col">Polarity</th><th scope="col" class="num">Delay (ms)</th></tr></thead><tbody>${rows}</tbody></table></div>`,
    note(block.note),
    '</section>',
  ].join('');
}

function renderDelay(block: DelayBlockAttrs, id: string): string {
  const unit = block.tempUnit === 'F' ? '°F' : '°C';
  const rows = block.rows
    .map((row) => {
      const r = delayResult(row, block);
      const source = row.mode === 'time' ? `${fixed(row.timeMs, 2)} ms (typed)` : `${num(row.distance, 2)} ${row.unit}`;
      const drift = row.mode === 'time' ? '—' : `${fixed(r.driftColdMs, 2)} / +${fixed(r.driftWarmMs, 2)}`.replace('+−', '−');
      return `<tr><th scope="row">${e(row.name || 'Output')}</th><td>${source}</td><td class="num">${fixed(row.latencyMs, 2)}</td><td class="num">${fixed(row.offsetMs, 2)}</td><td class="num"><strong>${fixed(r.setMs, 2)}</strong>${r.clipped ? ' (latency exceeds the delay: set 0)' : ''}</td><td class="num">${num(r.samples, 1)}</td><td class="num">${drift}</td></tr>`;
    })
    .join('');
  return [
    `<section class="tl-block tl-delay" aria-labelledby="${id}-h" data-block="${DELAY_BLOCK}">`,
    `<div id="${id}-h">${title('Delays', block.label)}</div>`,
    `<div class="tl-values"><table><caption>At ${num(block.temperature, 1)} ${unit}, ${rateLabel(block.sampleRate)}: delay = flight time + precedence offset − latency</caption><thead><tr><th scope="col">Output</th><th scope="col">Distance or time</th><th scope="col" class="num">Latency (ms)</th><th scope="col" class="num">Offset (ms)</th><th scope="col" class="num">Set (ms)</th><th scope="col" class="num">Samples</th><th scope="col" class="num">Drift at −10 / +10 °C (ms)</th></tr></thead><tbody>${rows}</tbody></table></div>`,
    note(block.note),
    '</section>',
  ].join('');
}

function safely(kind: string, render: () => string): string {
  try {
    return render();
  } catch (error) {
    // A row written before today's checks must not take the whole page down.
    if (error instanceof RangeError || error instanceof TypeError) {
      return `<section class="tl-block" role="note"><p>This ${e(kind)} block holds values that cannot be drawn (${e(error.message)}). Open the editor to correct it.</p></section>`;
    }
    throw error;
  }
}

/** Renderers for the processor blocks, numbering plot ids from `idPrefix` so several blocks (or renders) on one page never share an id. */
export function processorBlockRenderers(idPrefix = 'blk'): Record<string, BlockRenderer> {
  let count = 0;
  const next = () => `${idPrefix}-${++count}`;
  const attrs = <T>(node: PmNode) => (node.attrs ?? {}) as T;
  return {
    [EQ_BLOCK]: (node) => safely('EQ', () => renderEq(attrs<EqBlockAttrs>(node), next())),
    [CROSSOVER_BLOCK]: (node) => safely('crossover', () => renderCrossover(attrs<CrossoverBlockAttrs>(node), next())),
    [DELAY_BLOCK]: (node) => safely('delay', () => renderDelay(attrs<DelayBlockAttrs>(node), next())),
  };
}

/** A block in words, for search and the text diff. */
export function blockPlainText(node: PmNode): string | null {
  try {
    const a = node.attrs ?? {};
    if (node.type === EQ_BLOCK) {
      const b = a as unknown as EqBlockAttrs;
      return `EQ ${b.label}: ${b.bands.map((band, i) => `band ${i + 1} ${bandSummary(band)}`).join('; ')}. Output ${signedDb(b.outputGain)}, polarity ${b.polarity}. ${b.note}`;
    }
    if (node.type === CROSSOVER_BLOCK) {
      const b = a as unknown as CrossoverBlockAttrs;
      return `Crossover ${b.label}: ${b.ways.map((w) => `${w.name} high-pass ${w.highPass ? familyLabel(w.highPass) : 'none'}, low-pass ${w.lowPass ? familyLabel(w.lowPass) : 'none'}, ${signedDb(w.gain)}, ${w.polarity}, delay ${fixed(w.delayMs, 2)} ms`).join('; ')}. ${b.note}`;
    }
    if (node.type === DELAY_BLOCK) {
      const b = a as unknown as DelayBlockAttrs;
      return `Delays ${b.label}: ${b.rows.map((r) => `${r.name} ${fixed(delayResult(r, b).setMs, 2)} ms`).join('; ')}. ${b.note}`;
    }
  } catch {
    return null;
  }
  return null;
}

export { hz };
