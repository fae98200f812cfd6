import { AXIS_LABELS, DECADES, F_MAX, PLOT_WIDTH, dbRange, ticks, xOf } from '~/lib/plot/frequency-axis';
import PlotPane from './PlotPane';

interface Props {
  freqs: readonly number[];
  magnitudeDb: readonly number[];
  phaseDeg: readonly number[];
  nyquistHz: number;
}

/** Magnitude above phase, sharing one log frequency axis; drawn as SVG so it stays sharp on any phone. */
export default function ResponsePlot({ freqs, magnitudeDb, phaseDeg, nyquistHz }: Props) {
  const range = dbRange(magnitudeDb);
  const grid = { decades: DECADES.map(xOf), octaves: AXIS_LABELS.filter((f) => !DECADES.includes(f)).map(xOf), nyquist: nyquistHz < F_MAX ? xOf(nyquistHz) : undefined };
  return (
    <figure className="flex flex-col gap-2" data-testid="response-plot" aria-label="Frequency response: magnitude and phase">
      <PlotPane
        label="Magnitude"
        unit="dB"
        height={260}
        top={range.top}
        bottom={range.bottom}
        yTicks={ticks(range.bottom, range.top, range.step)}
        freqs={freqs}
        values={magnitudeDb}
        grid={grid}
        strokeClass="stroke-accent"
        testId="plot-magnitude"
      />
      <PlotPane
        label="Phase"
        unit="°"
        height={160}
        top={180}
        bottom={-180}
        yTicks={[-180, -90, 0, 90, 180]}
        freqs={freqs}
        values={phaseDeg}
        grid={grid}
        strokeClass="stroke-ok"
        wrapAt={180}
        showFrequencyLabels
        testId="plot-phase"
      />
      <figcaption className="sr-only">
        Plot from 20 Hz to 20 kHz on a logarithmic axis, {PLOT_WIDTH} units wide; magnitude from {range.bottom} to {range.top} dB.
      </figcaption>
    </figure>
  );
}
