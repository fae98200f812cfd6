import { fillDelayMs, metersFromTyped, msToSamples } from '~/lib/acoustics';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { GUIDE, type DelayPanelProps } from './delay-state';
import SaveToPage from '~/components/calc/SaveToPage';
import { delayBlockFromCalc } from '~/lib/doc/blocks/calc-blocks';

/** Delay for a fill loudspeaker so the main arrives first at the listener. */
export default function FillPanel({ s, set, air }: DelayPanelProps) {
  const outcome = attempt(() => {
    if (!air.ok) throw new RangeError(air.message);
    const result = fillDelayMs({
      mainMeters: metersFromTyped(num(s.main, 'the distance to the main'), s.unit, 'The main distance'),
      fillMeters: metersFromTyped(num(s.fill, 'the distance to the fill'), s.unit, 'The fill distance'),
      temperatureCelsius: air.value.celsius,
      relativeHumidityPercent: air.value.rh,
      precedenceOffsetMs: num(s.offset, 'the precedence offset'),
      latencyMs: num(s.latency ?? '0', 'the fill latency'),
    });
    return { ...result, samples: msToSamples(result.delayMs, num(s.rate, 'the sample rate')) };
  });
  return (
    <Panel title="Fill alignment" guide={`${GUIDE}#fill-alignment`} testId="fill-panel">
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Main to listener" value={s.main} onChange={(main) => set({ main })} unit={s.unit} testId="fill-main" />
        <NumberField label="Fill to listener" value={s.fill} onChange={(fill) => set({ fill })} unit={s.unit} testId="fill-fill" />
      </div>
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Precedence offset" value={s.offset} onChange={(offset) => set({ offset })} unit="ms" hint="So the main still leads: 5–10 ms is common practice." testId="fill-offset" />
        <NumberField label="Fill path latency" value={s.latency ?? '0'} onChange={(latency) => set({ latency })} unit="ms" hint="Extra wireless or DSP latency on the fill's feed." testId="fill-latency" />
      </div>
      <Result outcome={outcome} testId="fill-result">
        {({ delayMs, delayOn, samples, fillLagMs }) => (
          <div className="flex flex-col gap-2">
            {delayOn === 'none' ? (
              <div>
                <div className="text-3xl font-bold" data-testid="fill-delay">
                  No delay needed
                </div>
                <p className="text-sm text-muted" data-testid="fill-none">
                  The fill already arrives {fixed(fillLagMs, 2)} ms after the main, which keeps the main leading.
                </p>
              </div>
            ) : (
            <div className="flex flex-wrap gap-x-6 gap-y-2">
              <Figure label={delayOn === 'fill' ? 'Delay the fill by' : 'The main would need'} value={s.timeUnit === 'samples' ? fixed(samples, 0) : fixed(delayMs, 2)} unit={s.timeUnit} big testId="fill-delay" />
              <Figure label={s.timeUnit === 'samples' ? 'In ms' : 'In samples'} value={s.timeUnit === 'samples' ? fixed(delayMs, 2) : fixed(samples, 0)} unit={s.timeUnit === 'samples' ? 'ms' : 'samples'} />
            </div>
            )}
            {delayOn === 'main' && (
              <p className="text-sm text-warn">
                The fill is farther from this listener than the offset allows, so no fill delay can line them up. Delaying the main instead moves everything it covers; check the
                positions first.
              </p>
            )}
          </div>
        )}
      </Result>
      <SaveToPage
        testId="fill-save"
        build={() =>
          outcome.ok && outcome.value.delayOn === 'fill'
            ? {
                // The fill's delay is the path difference plus the offset: stored as that distance so it follows the temperature.
                nodes: [
                  delayBlockFromCalc({
                    name: 'Fill',
                    label: 'Fill alignment from the calculator',
                    sampleRate: num(s.rate, 'the sample rate'),
                    temperature: num(s.temp, 'the temperature'),
                    tempUnit: s.tempUnit === 'F' ? 'F' : 'C',
                    distance: Math.max(0, num(s.main, 'the distance to the main') - num(s.fill, 'the distance to the fill')),
                    unit: s.unit === 'ft' ? 'ft' : 'm',
                    offsetMs: num(s.offset, 'the precedence offset'),
                  }),
                ],
                summary: `Fill delay ${fixed(outcome.value.delayMs, 2)} ms from the fill calculator`,
              }
            : null
        }
      />
    </Panel>
  );
}
