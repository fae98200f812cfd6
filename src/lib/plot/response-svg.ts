/**
 * A response plot as an SVG string: magnitude (and optionally phase) over the shared log axis,
 * with labelled gridlines, a title and a description for screen readers. The server renders it
 * into read pages and history; the editor and the calculator draw the same string live.
 */
import { escapeHtml } from '~/lib/doc/escape-html';
import { AXIS_LABELS, DECADES, F_MAX, F_MIN, MINOR_LINES, PLOT_WIDTH, curvePath, dbRange, hzLabel, ticks, xOf, yScale } from './frequency-axis';

/** How a curve is drawn: the total bold, each band faint under it, prototypes dashed, before/after apart. */
export type CurveRole = 'total' | 'part' | 'prototype' | 'sum' | 'before' | 'after';

export interface PlotCurve {
  role: CurveRole;
  freqs: readonly number[];
  values: readonly (number | null)[];
  /** Shown in the legend when given. */
  label?: string;
}

export interface ResponseSvgInput {
  /** Short name, the SVG's <title>. */
  title: string;
  /** A sentence saying what the plot shows, the SVG's <desc>. */
  description: string;
  magnitude: PlotCurve[];
  phase?: PlotCurve[];
  /** Fixed dB range; by default fitted to the curves. */
  range?: { top: number; bottom: number; step: number };
  /** Draws a warning line at Nyquist when it falls inside the axis. */
  nyquistHz?: number;
  idPrefix: string;
}

const LEFT = 44;
const RIGHT = 12;
const MAG_HEIGHT = 220;
const PHASE_HEIGHT = 90;
const GAP = 26;
const AXIS_TEXT = 18;

const n = (v: number) => v.toFixed(1);

function pane(curves: PlotCurve[], top: number, bottom: number, yTicks: number[], height: number, y0: number, unit: string, wrapAt: number | undefined, nyquistHz: number | undefined): string {
  const yOf = yScale(top, bottom, height);
  const parts: string[] = [`<g transform="translate(${LEFT} ${y0})">`, `<rect class="tl-plot-bg" x="0" y="0" width="${PLOT_WIDTH}" height="${height}"/>`];
  for (const f of MINOR_LINES) parts.push(`<path class="tl-grid-minor" d="M${n(xOf(f))} 0V${height}"/>`);
  for (const f of AXIS_LABELS) parts.push(`<path class="${DECADES.includes(f) ? 'tl-grid-major' : 'tl-grid'}" d="M${n(xOf(f))} 0V${height}"/>`);
  for (const v of yTicks) {
    parts.push(`<path class="${v === 0 ? 'tl-grid-major' : 'tl-grid'}" d="M0 ${n(yOf(v))}H${PLOT_WIDTH}"/>`);
    parts.push(`<text class="tl-axis" x="-6" y="${n(yOf(v) + 4)}" text-anchor="end">${v > 0 ? `+${v}` : v}${unit}</text>`);
  }
  if (nyquistHz !== undefined && nyquistHz < F_MAX) parts.push(`<path class="tl-nyquist" d="M${n(xOf(nyquistHz))} 0V${height}"/>`);
  parts.push(`<svg x="0" y="0" width="${PLOT_WIDTH}" height="${height}" overflow="hidden">`);
  // Faint parts first so the total is drawn on top of them.
  const order: CurveRole[] = ['part', 'prototype', 'before', 'after', 'total', 'sum'];
  for (const role of order) {
    for (const c of curves.filter((curve) => curve.role === role)) {
      const d = curvePath(c.freqs, c.values, yOf, wrapAt);
      if (d) parts.push(`<path class="tl-curve tl-curve-${role}" d="${d}"${c.label ? ` data-label="${escapeHtml(c.label)}"` : ''}/>`);
    }
  }
  parts.push('</svg></g>');
  return parts.join('');
}

function legend(curves: PlotCurve[], y: number): string {
  const labelled = curves.filter((c) => c.label && c.role !== 'part');
  let x = LEFT;
  return labelled
    .map((c) => {
      const item = `<path class="tl-curve tl-curve-${c.role}" d="M${x} ${y - 4}h22"/><text class="tl-axis" x="${x + 28}" y="${y}">${escapeHtml(c.label!)}</text>`;
      x += 40 + c.label!.length * 7.5;
      return item;
    })
    .join('');
}

/** The plot as one self-contained <svg> element (no script, no external references). */
export function responseSvg(input: ResponseSvgInput): string {
  const values = input.magnitude.flatMap((c) => c.values.filter((v): v is number => v !== null));
  const range = input.range ?? dbRange(values);
  const magTicks = ticks(range.bottom, range.top, range.step);
  const phaseTop = MAG_HEIGHT + GAP;
  const hasPhase = Boolean(input.phase?.length);
  const axisY = (hasPhase ? phaseTop + PHASE_HEIGHT : MAG_HEIGHT) + AXIS_TEXT;
  const legendY = axisY + 22;
  const hasLegend = [...input.magnitude].some((c) => c.label && c.role !== 'part');
  const height = (hasLegend ? legendY : axisY) + 8;
  const width = LEFT + PLOT_WIDTH + RIGHT;
  const id = escapeHtml(input.idPrefix);
  const parts = [
    `<svg class="tl-plot" viewBox="0 0 ${width} ${height}" role="img" aria-labelledby="${id}-t ${id}-d" xmlns="http://www.w3.org/2000/svg">`,
    `<title id="${id}-t">${escapeHtml(input.title)}</title>`,
    `<desc id="${id}-d">${escapeHtml(input.description)} Frequency from ${F_MIN} Hz to ${F_MAX / 1000} kHz on a logarithmic axis; magnitude from ${range.bottom} to +${range.top} dB.</desc>`,
    pane(input.magnitude, range.top, range.bottom, magTicks, MAG_HEIGHT, 0, '', undefined, input.nyquistHz),
  ];
  if (hasPhase) parts.push(pane(input.phase!, 180, -180, [-180, -90, 0, 90, 180], PHASE_HEIGHT, phaseTop, '°', 180, input.nyquistHz));
  for (const f of AXIS_LABELS) parts.push(`<text class="tl-axis" x="${n(LEFT + xOf(f))}" y="${axisY}" text-anchor="middle">${hzLabel(f)}</text>`);
  parts.push(`<text class="tl-axis tl-unit" x="${LEFT - 6}" y="${axisY}" text-anchor="end">Hz</text>`);
  if (hasLegend) parts.push(legend(input.magnitude, legendY));
  parts.push('</svg>');
  return parts.join('');
}

/** The y coordinate, in the SVG's own units, where `db` sits on the magnitude pane of a plot with `range` (for checks). */
export function magnitudeY(db: number, range: { top: number; bottom: number }): number {
  return yScale(range.top, range.bottom, MAG_HEIGHT)(db);
}
