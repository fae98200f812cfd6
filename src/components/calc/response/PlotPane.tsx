import { AXIS_LABELS, PLOT_WIDTH, curvePath, hzLabel, xOf, yScale } from '~/lib/plot/frequency-axis';

interface Grid {
  decades: number[];
  octaves: number[];
  nyquist?: number;
}

interface Props {
  label: string;
  unit: string;
  height: number;
  top: number;
  bottom: number;
  yTicks: number[];
  freqs: readonly number[];
  values: readonly number[];
  grid: Grid;
  strokeClass: string;
  wrapAt?: number;
  showFrequencyLabels?: boolean;
  testId?: string;
}

/**
 * One pane of the plot. The SVG stretches to the width it is given (preserveAspectRatio none,
 * non-scaling strokes) while the axis labels are HTML placed by percentage, so text keeps its
 * size on a 390 px phone and on a desktop alike.
 */
export default function PlotPane({ label, unit, height, top, bottom, yTicks, freqs, values, grid, strokeClass, wrapAt, showFrequencyLabels, testId }: Props) {
  // Values past the range leave the box steeply and are cut off by the SVG edge, instead of
  // crawling along the border as if the response were flat there.
  const yOf = yScale(top, bottom, height);
  const pct = (y: number) => `${(y / height) * 100}%`;
  const line = 'fill-none [vector-effect:non-scaling-stroke]';
  return (
    <div className="pl-9" data-testid={testId}>
      <div className="mb-1 text-xs font-semibold uppercase tracking-wide text-muted">
        {label} ({unit})
      </div>
      <div className="relative rounded-md border border-line bg-sunken" style={{ height: `${height}px` }}>
        <svg viewBox={`0 0 ${PLOT_WIDTH} ${height}`} preserveAspectRatio="none" className="absolute inset-0 h-full w-full overflow-hidden" aria-hidden="true">
          {grid.octaves.map((x) => <path key={`o${x}`} d={`M${x} 0V${height}`} className={`${line} stroke-line`} strokeWidth={1} strokeDasharray="3 3" />)}
          {grid.decades.map((x) => <path key={`d${x}`} d={`M${x} 0V${height}`} className={`${line} stroke-muted`} strokeWidth={1} />)}
          {yTicks.map((v) => <path key={`y${v}`} d={`M0 ${yOf(v)}H${PLOT_WIDTH}`} className={`${line} ${v === 0 ? 'stroke-muted' : 'stroke-line'}`} strokeWidth={1} />)}
          {grid.nyquist !== undefined && <path d={`M${grid.nyquist} 0V${height}`} className={`${line} stroke-warn`} strokeWidth={1} strokeDasharray="6 4" />}
          <path d={curvePath(freqs, values, yOf, wrapAt)} className={`${line} ${strokeClass}`} strokeWidth={2.5} strokeLinejoin="round" data-testid={testId && `${testId}-curve`} />
        </svg>
        {yTicks.map((v) => (
          <span key={v} className="absolute -left-9 w-8 -translate-y-1/2 text-right text-[11px] tabular-nums text-muted" style={{ top: pct(yOf(v)) }}>
            {v > 0 ? `+${v}` : v}
          </span>
        ))}
      </div>
      {showFrequencyLabels && (
        <div className="relative h-5" aria-hidden="true">
          {AXIS_LABELS.map((f) => (
            <span key={f} className="absolute -translate-x-1/2 text-[11px] tabular-nums text-muted first:translate-x-0 last:-translate-x-full" style={{ left: `${(xOf(f) / PLOT_WIDTH) * 100}%` }}>
              {hzLabel(f)}
            </span>
          ))}
        </div>
      )}
    </div>
  );
}
