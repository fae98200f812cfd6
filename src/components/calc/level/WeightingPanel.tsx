import { aWeightingDb, cWeightingDb, tabulatedFrequency, weightingDb, type WeightingCurve } from '~/lib/acoustics';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { GUIDE, type LevelPanelProps } from './level-state';

const CURVES = [
  { value: 'A', label: 'A' },
  { value: 'C', label: 'C' },
  { value: 'Z', label: 'Z' },
] as const;

/** A, C or Z weighting at one frequency, with the other two beside it for comparison. */
export default function WeightingPanel({ s, set }: LevelPanelProps) {
  const curve = (CURVES.some((c) => c.value === s.curve) ? s.curve : 'A') as WeightingCurve;
  const outcome = attempt(() => {
    const at = tabulatedFrequency(num(s.wfreq, 'the frequency'));
    const f = at.frequencyHz;
    return { chosen: weightingDb(curve, f), a: aWeightingDb(f), c: cWeightingDb(f), at };
  });
  return (
    <Panel title="Weighting" guide={`${GUIDE}#weighting`} testId="weighting-panel">
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Frequency" value={s.wfreq} onChange={(wfreq) => set({ wfreq })} unit="Hz" testId="weighting-freq" />
        <Choice label="Curve" value={curve} onChange={(c) => set({ curve: c })} options={CURVES} testId="weighting-curve" />
      </div>
      <Result outcome={outcome} testId="weighting-result">
        {({ chosen, a, c, at }) => (
          <div className="flex flex-col gap-2">
          {at.nominalHz !== undefined && (
            <p className="text-sm text-muted" data-testid="weighting-exact">
              {at.nominalHz} Hz is a nominal band frequency: computed at the exact {at.frequencyHz.toPrecision(5)} Hz, as IEC 61672-1 Table 3 is.
            </p>
          )}
          <div className="flex flex-wrap gap-x-6 gap-y-2">
            <Figure label={`${curve}-weighting`} value={`${chosen > 0 ? '+' : ''}${fixed(chosen, 1)}`} unit="dB" big testId="weighting-db" />
            {curve !== 'A' && <Figure label="A" value={fixed(a, 1)} unit="dB" />}
            {curve !== 'C' && <Figure label="C" value={fixed(c, 1)} unit="dB" />}
          </div>
          </div>
        )}
      </Result>
    </Panel>
  );
}
