import Choice from '~/components/calc/Choice';
import { lengthFromMeters } from '~/lib/acoustics';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import SelectField from '~/components/calc/SelectField';
import { fixed } from '~/components/calc/format';
import { SAMPLE_RATES, convertText, lengthTo, temperatureTo } from '~/components/calc/unit-switch';
import { GUIDE, type DelayPanelProps } from './delay-state';

/** Air temperature and the units every other delay panel speaks. */
export default function AirPanel({ s, set, air }: DelayPanelProps) {
  const switchLength = (unit: string) => {
    if (unit === s.unit) return;
    const to = lengthTo(unit);
    set({ unit, dist: convertText(s.dist, to), main: convertText(s.main, to), fill: convertText(s.fill, to) });
  };
  const switchTemperature = (tempUnit: string) => {
    if (tempUnit !== s.tempUnit) set({ tempUnit, temp: convertText(s.temp, temperatureTo(tempUnit), 1) });
  };
  const switchTime = (timeUnit: string) => {
    if (timeUnit === s.timeUnit) return;
    const rate = Number(s.rate);
    const toSamples = timeUnit === 'samples';
    set({ timeUnit, time: rate > 0 ? convertText(s.time, (v) => (toSamples ? (v * rate) / 1000 : (v * 1000) / rate), toSamples ? 1 : 3) : s.time });
  };
  return (
    <Panel title="Air and units" guide={`${GUIDE}#speed-of-sound`} testId="air-panel">
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Air temperature" value={s.temp} onChange={(temp) => set({ temp })} unit={`°${s.tempUnit}`} signed testId="temp" />
        <Choice label="Temperature in" value={s.tempUnit} onChange={switchTemperature} options={[{ value: 'C', label: '°C' }, { value: 'F', label: '°F' }]} testId="temp-unit" />
        <Choice label="Distances in" value={s.unit} onChange={switchLength} options={[{ value: 'm', label: 'm' }, { value: 'ft', label: 'ft' }]} testId="length-unit" />
        <Choice label="Times in" value={s.timeUnit} onChange={switchTime} options={[{ value: 'ms', label: 'ms' }, { value: 'samples', label: 'samples' }]} testId="time-unit" />
      </div>
      <NumberField label="Relative humidity (optional)" value={s.rh ?? ''} onChange={(rh) => set({ rh })} unit="%" hint="Leave empty for dry air; humid air is faster (Cramer 1993)." testId="rh" />
      <SelectField label="Sample rate" value={s.rate} options={SAMPLE_RATES} onChange={(rate) => set({ rate })} testId="rate" />
      <Result outcome={air} testId="speed-result">
        {({ speed }) => (
          <div className="flex gap-6">
            <Figure label="Speed of sound" value={fixed(speed, 1)} unit="m/s" />
            <Figure label="" value={fixed(lengthFromMeters(speed, 'ft'), 0)} unit="ft/s" />
          </div>
        )}
      </Result>
    </Panel>
  );
}
