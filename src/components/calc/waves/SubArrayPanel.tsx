import { lengthFromMeters, subArray, type SubArrayKind } from '~/lib/acoustics';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { GUIDE, type WavesPanelProps } from './waves-state';

/** Quarter-wave spacing, delay and polarity for a directional sub array. */
export default function SubArrayPanel({ s, set, air }: WavesPanelProps) {
  const outcome = attempt(() => {
    if (!air.ok) throw new RangeError(air.message);
    return subArray(num(s.sfreq, 'the frequency to steer'), s.kind as SubArrayKind, air.value.celsius);
  });
  return (
    <Panel title="Sub array" guide={`${GUIDE}#sub-arrays`} testId="subarray-panel">
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Steer at" value={s.sfreq} onChange={(sfreq) => set({ sfreq })} unit="Hz" testId="subarray-freq" />
        <Choice label="Layout" value={s.kind} onChange={(kind) => set({ kind })} options={[{ value: 'gradient', label: 'Gradient' }, { value: 'end-fire', label: 'End-fire' }]} testId="subarray-kind" />
      </div>
      <Result outcome={outcome} testId="subarray-result">
        {(r) => (
          <div className="flex flex-col gap-2">
            <div className="flex flex-wrap gap-x-6 gap-y-2">
              <Figure label="Spacing" value={fixed(lengthFromMeters(r.spacing, s.unit), 2)} unit={s.unit} big testId="subarray-spacing" />
              <Figure label={r.delayOn === 'rear' ? 'Delay the rear' : 'Delay per box ahead'} value={fixed(r.delayMs, 2)} unit="ms" testId="subarray-delay" />
              <Figure label="Polarity behind" value={r.invertPolarity ? 'Inverted' : 'Normal'} testId="subarray-polarity" />
            </div>
            <p className="text-sm text-muted">{r.summary}</p>
          </div>
        )}
      </Result>
    </Panel>
  );
}
