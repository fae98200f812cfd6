import { celsiusFromTyped, requireHumidity, speedOfSound } from '~/lib/acoustics';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { convertText, lengthTo, temperatureTo } from '~/components/calc/unit-switch';
import { useQueryState } from '~/components/calc/use-query-state';
import AirLossPanel from './AirLossPanel';
import CombPanel from './CombPanel';
import SubArrayPanel from './SubArrayPanel';
import WavelengthPanel from './WavelengthPanel';
import { GUIDE, WAVES_DEFAULTS, WAVES_REMEMBERED } from './waves-state';

/** ISO 9613-1's own example conditions use 50 %; a typical indoor figure too. */
const DEFAULT_RH = 50;

/** Wavelength, comb filtering, air absorption and sub arrays: one air and one set of units feed them all. */
export default function WavesCalculator({ search }: { search: string }) {
  const [s, set] = useQueryState(WAVES_DEFAULTS, search, WAVES_REMEMBERED);
  const air = attempt(() => {
    const celsius = celsiusFromTyped(num(s.temp, 'the air temperature'), s.tempUnit);
    // The delay screen shares this key and leaves it empty for dry air; absorption needs a figure, so empty reads as 50 %.
    const rh = requireHumidity((s.rh ?? '').trim() === '' ? DEFAULT_RH : num(s.rh, 'the relative humidity'));
    return { celsius, rh, speed: speedOfSound(celsius, rh) };
  });
  const switchLength = (unit: string) => unit !== s.unit && set({ unit, cdist: convertText(s.cdist, lengthTo(unit)), adist: convertText(s.adist, lengthTo(unit)) });
  const switchTemperature = (tempUnit: string) => tempUnit !== s.tempUnit && set({ tempUnit, temp: convertText(s.temp, temperatureTo(tempUnit), 1) });
  const props = { s, set, air };
  return (
    <div className="flex flex-col gap-4" data-testid="waves-calculator">
      <Panel title="Air and units" guide={`${GUIDE}#air`} testId="waves-air-panel">
        <div className="grid grid-cols-2 gap-3">
          <NumberField label="Air temperature" value={s.temp} onChange={(temp) => set({ temp })} unit={`°${s.tempUnit}`} signed testId="waves-temp" />
          <NumberField label="Relative humidity" value={s.rh} onChange={(rh) => set({ rh })} unit="%" hint={(s.rh ?? '').trim() === '' ? `Empty: ${DEFAULT_RH} % assumed.` : undefined} testId="waves-rh" />
          <Choice label="Temperature in" value={s.tempUnit} onChange={switchTemperature} options={[{ value: 'C', label: '°C' }, { value: 'F', label: '°F' }]} testId="waves-temp-unit" />
          <Choice label="Distances in" value={s.unit} onChange={switchLength} options={[{ value: 'm', label: 'm' }, { value: 'ft', label: 'ft' }]} testId="waves-length-unit" />
        </div>
        <Result outcome={air} testId="waves-speed" share={false}>
          {({ speed }) => <Figure label="Speed of sound" value={fixed(speed, 1)} unit="m/s" />}
        </Result>
      </Panel>
      <WavelengthPanel {...props} />
      <CombPanel {...props} />
      <AirLossPanel {...props} />
      <SubArrayPanel {...props} />
    </div>
  );
}
