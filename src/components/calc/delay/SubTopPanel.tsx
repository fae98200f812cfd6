import { msToSamples, subToTopOffset } from '~/lib/acoustics';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { GUIDE, type DelayPanelProps } from './delay-state';

/** Time offset between sub and top from the phase difference measured at the crossover. */
export default function SubTopPanel({ s, set }: DelayPanelProps) {
  const outcome = attempt(() => {
    const result = subToTopOffset(num(s.xover, 'the crossover frequency'), num(s.phase, 'the phase difference'));
    const rate = num(s.rate, 'the sample rate');
    return { ...result, samples: msToSamples(result.offsetMs, rate), periodSamples: msToSamples(result.periodMs, rate) };
  });
  const inSamples = s.timeUnit === 'samples';
  return (
    <Panel title="Sub and top" guide={`${GUIDE}#sub-and-top`} testId="subtop-panel">
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Crossover" value={s.xover} onChange={(xover) => set({ xover })} unit="Hz" testId="subtop-xover" />
        <NumberField label="Sub lags top by" value={s.phase} onChange={(phase) => set({ phase })} unit="°" signed hint="Negative when the sub leads." testId="subtop-phase" />
      </div>
      <Result outcome={outcome} testId="subtop-result">
        {({ offsetMs, delayOn, periodMs, samples, periodSamples }) => (
          <div className="flex flex-col gap-2">
            <Figure label={`Delay the ${delayOn} by`} value={inSamples ? fixed(samples, 0) : fixed(offsetMs, 2)} unit={s.timeUnit} big testId="subtop-offset" />
            <p className="text-sm text-muted">
              One cycle at the crossover lasts {inSamples ? `${fixed(periodSamples, 0)} samples` : `${fixed(periodMs, 2)} ms`}: adding or removing whole cycles lines up the
              phase just as well. Pick the candidate that also lines up the arrivals (impulse peaks or measured distances).
            </p>
          </div>
        )}
      </Result>
    </Panel>
  );
}
