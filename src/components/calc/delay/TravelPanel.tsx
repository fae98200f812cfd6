import { delayMs, distanceFromMs, metersFromTyped, msToSamples, samplesToMs } from '~/lib/acoustics';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { fromMeters } from '~/components/calc/unit-switch';
import { GUIDE, type DelayPanelProps } from './delay-state';
import SaveToPage from '~/components/calc/SaveToPage';
import { delayBlockFromCalc } from '~/lib/doc/blocks/calc-blocks';

/** Distance ↔ milliseconds ↔ samples, from either end. */
export default function TravelPanel({ s, set, air }: DelayPanelProps) {
  const fromDistance = s.start !== 'time';
  const outcome = attempt(() => {
    if (!air.ok) throw new RangeError(air.message);
    const rate = num(s.rate, 'the sample rate');
    if (fromDistance) {
      const ms = delayMs(metersFromTyped(num(s.dist, 'the distance'), s.unit), air.value.celsius, air.value.rh);
      return { ms, samples: msToSamples(ms, rate), meters: null };
    }
    const typed = num(s.time, s.timeUnit === 'samples' ? 'the number of samples' : 'the time');
    const ms = s.timeUnit === 'samples' ? samplesToMs(typed, rate) : typed;
    return { ms, samples: msToSamples(ms, rate), meters: distanceFromMs(ms, air.value.celsius, air.value.rh) };
  });
  const timeFigures = (ms: number, samples: number) => {
    const msFigure = <Figure key="ms" label="Time" value={fixed(ms, 2)} unit="ms" big={s.timeUnit === 'ms'} testId="travel-ms" />;
    const samplesFigure = (
      <Figure key="samples" label={`Samples (≈ ${Math.round(samples)})`} value={fixed(samples, 1)} unit="samples" big={s.timeUnit === 'samples'} testId="travel-samples" />
    );
    return s.timeUnit === 'samples' ? [samplesFigure, msFigure] : [msFigure, samplesFigure];
  };
  return (
    <Panel title="Travel time" guide={`${GUIDE}#travel-time`} testId="travel-panel">
      <Choice label="Start from" value={fromDistance ? 'distance' : 'time'} onChange={(start) => set({ start })} options={[{ value: 'distance', label: 'Distance' }, { value: 'time', label: 'Time' }]} testId="travel-start" />
      {fromDistance ? (
        <NumberField label="Distance" value={s.dist} onChange={(dist) => set({ dist })} unit={s.unit} testId="travel-distance" />
      ) : (
        <NumberField label={s.timeUnit === 'samples' ? 'Delay in samples' : 'Delay time'} value={s.time} onChange={(time) => set({ time })} unit={s.timeUnit} testId="travel-time" />
      )}
      <Result outcome={outcome} testId="travel-result">
        {({ ms, samples, meters }) => (
          <div className="flex flex-wrap gap-x-6 gap-y-2">
            {meters !== null && <Figure label="Distance" value={fixed(fromMeters(meters, s.unit), 2)} unit={s.unit} big testId="travel-distance-result" />}
            {timeFigures(ms, samples)}
          </div>
        )}
      </Result>
      <SaveToPage
        testId="travel-save"
        build={() =>
          outcome.ok && air.ok
            ? {
                nodes: [
                  delayBlockFromCalc({
                    name: 'Output',
                    label: 'Delay from the calculator',
                    sampleRate: num(s.rate, 'the sample rate'),
                    temperature: num(s.temp, 'the temperature'),
                    tempUnit: s.tempUnit === 'F' ? 'F' : 'C',
                    ...(fromDistance ? { distance: num(s.dist, 'the distance'), unit: s.unit === 'ft' ? 'ft' : 'm' } : { timeMs: outcome.value.ms }),
                  }),
                ],
                summary: `Delay ${fixed(outcome.value.ms, 2)} ms from the delay calculator`,
              }
            : null
        }
      />
    </Panel>
  );
}
