import { MAX_SPL_CAUTION, maxSpl, metersFromTyped, type SensitivityReference } from '~/lib/acoustics';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { convertText, lengthTo } from '~/components/calc/unit-switch';
import { GUIDE, type LevelsPanelProps } from './levels-state';

/** The on-paper ceiling at a distance, with the power-compression caution always shown. */
export default function MaxSplPanel({ s, set }: LevelsPanelProps) {
  const is283 = s.sref === '2.83V';
  const outcome = attempt(() =>
    maxSpl({
      sensitivityDb: num(s.sens, 'the sensitivity'),
      sensitivityRef: s.sref as SensitivityReference,
      ohms: is283 ? num(s.zbox, 'the nominal impedance') : undefined,
      powerWatts: num(s.power, 'the amplifier power'),
      distanceMeters: metersFromTyped(num(s.mdist, 'the distance'), s.unit, 'The distance', true),
      boxes: num(s.boxes, 'the number of boxes'),
    }),
  );
  const switchUnit = (unit: string) => unit !== s.unit && set({ unit, mdist: convertText(s.mdist, lengthTo(unit)) });
  return (
    <Panel title="Maximum SPL" guide={`${GUIDE}#maximum-spl`} testId="maxspl-panel">
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Sensitivity" value={s.sens} onChange={(sens) => set({ sens })} unit="dB" testId="maxspl-sens" />
        <Choice label="Measured at" value={s.sref} onChange={(sref) => set({ sref })} options={[{ value: '1W', label: '1 W' }, { value: '2.83V', label: '2.83 V' }]} testId="maxspl-ref" />
        {is283 && <NumberField label="Nominal impedance" value={s.zbox} onChange={(zbox) => set({ zbox })} unit="Ω" testId="maxspl-ohms" />}
        <NumberField label="Power per box" value={s.power} onChange={(power) => set({ power })} unit="W" testId="maxspl-power" />
        <NumberField label="Distance" value={s.mdist} onChange={(mdist) => set({ mdist })} unit={s.unit} testId="maxspl-distance" />
        <Choice label="Distance in" value={s.unit} onChange={switchUnit} options={[{ value: 'm', label: 'm' }, { value: 'ft', label: 'ft' }]} testId="maxspl-unit" />
        <NumberField label="Boxes" value={s.boxes} onChange={(boxes) => set({ boxes })} hint="Summed as one coherent source: +6 dB per doubling." testId="maxspl-boxes" />
      </div>
      <Result outcome={outcome} testId="maxspl-result">
        {(r) => (
          <div className="flex flex-wrap gap-x-6 gap-y-2">
            <Figure label="At most, on paper" value={fixed(r.level, 1)} unit="dB SPL" big testId="maxspl-level" />
            {is283 && <Figure label="Sensitivity at 1 W" value={fixed(r.sensitivity1W, 1)} unit="dB" />}
          </div>
        )}
      </Result>
      <p className="rounded-lg bg-warn-soft p-3 text-sm text-fg" data-testid="maxspl-caution">
        <strong className="text-warn">Caution. </strong>
        {MAX_SPL_CAUTION}
      </p>
    </Panel>
  );
}
