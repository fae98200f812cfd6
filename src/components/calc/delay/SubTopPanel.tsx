import { msToSamples, periodMs, subTopCandidates } from '~/lib/acoustics';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { GUIDE, type DelayPanelProps } from './delay-state';

/** Every usual fix for the phase difference measured at the crossover, best first. */
export default function SubTopPanel({ s, set }: DelayPanelProps) {
  const outcome = attempt(() => {
    const freq = num(s.xover, 'the crossover frequency');
    const rate = num(s.rate, 'the sample rate');
    const candidates = subTopCandidates(freq, num(s.phase, 'the phase difference')).map((c) => ({ ...c, samples: msToSamples(c.delayMs, rate) }));
    return { candidates, period: periodMs(freq) };
  });
  const inSamples = s.timeUnit === 'samples';
  return (
    <Panel title="Sub and top" guide={`${GUIDE}#sub-and-top`} testId="subtop-panel">
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Crossover" value={s.xover} onChange={(xover) => set({ xover })} unit="Hz" testId="subtop-xover" />
        <NumberField label="Sub lags top by" value={s.phase} onChange={(phase) => set({ phase })} unit="°" signed hint="Negative when the sub leads." testId="subtop-phase" />
      </div>
      <Result outcome={outcome} testId="subtop-result">
        {({ candidates, period }) => (
          <div className="flex flex-col gap-2">
            <ol className="flex flex-col gap-2" data-testid="subtop-candidates">
              {candidates.map((c, i) => (
                <li key={i} className={`rounded-lg border border-line p-2 ${i === 0 ? 'bg-surface' : ''}`} data-testid={`subtop-candidate-${i}`}>
                  <div className={i === 0 ? 'text-lg font-bold' : 'font-semibold'}>
                    {c.invertPolarity ? 'Invert the sub' : ''}
                    {c.invertPolarity && c.delayOn !== 'none' ? ' and delay the ' : c.delayOn !== 'none' ? 'Delay the ' : ''}
                    {c.delayOn !== 'none' && `${c.delayOn} by ${inSamples ? `${fixed(c.samples, 0)} samples` : `${fixed(c.delayMs, 2)} ms`}`}
                  </div>
                  <div className="text-sm text-muted">
                    Phase left at the crossover: {fixed(c.phaseErrorDeg, 0)}°{c.action.includes('cycle') ? ` · ${c.action.includes('later') ? 'one cycle later' : 'one cycle earlier'}` : ''}
                  </div>
                </li>
              ))}
            </ol>
            <p className="text-sm text-muted">
              One cycle at the crossover lasts {inSamples ? `${fixed(msToSamples(period, num(s.rate, 'the sample rate')), 0)} samples` : `${fixed(period, 2)} ms`}: whole cycles line up the phase
              just as well. A polarity flip alone is exact only at 180°. Pick the candidate that also lines up the arrivals (impulse peaks or measured distances).
            </p>
          </div>
        )}
      </Result>
    </Panel>
  );
}
