import { proConsumerGapDb, signalLevel, type SignalUnit } from '~/lib/acoustics';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import SelectField from '~/components/calc/SelectField';
import { attempt, num } from '~/components/calc/attempt';
import { fixed, sig } from '~/components/calc/format';
import { GUIDE, type LevelsPanelProps } from './levels-state';

const UNITS = [
  { value: 'dBu', label: 'dBu' },
  { value: 'dBV', label: 'dBV' },
  { value: 'dBFS', label: 'dBFS' },
  { value: 'V', label: 'volts' },
  { value: 'W', label: 'watts' },
] as const;

/** One level in dBu, dBV, dBFS, volts and, with a load, watts. */
export default function SignalLevelPanel({ s, set }: LevelsPanelProps) {
  const outcome = attempt(() => {
    const ohms = s.sohms.trim() === '' ? undefined : num(s.sohms, 'the load');
    return signalLevel(num(s.sval, 'the level'), s.sunit as SignalUnit, num(s.fs, 'the console’s full scale'), ohms);
  });
  return (
    <Panel title="Signal level" guide={`${GUIDE}#signal-level`} testId="line-panel">
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Level" value={s.sval} onChange={(sval) => set({ sval })} unit={s.sunit === 'V' ? 'V' : s.sunit === 'W' ? 'W' : s.sunit} signed testId="line-value" />
        <SelectField label="In" value={s.sunit} options={UNITS} onChange={(sunit) => set({ sunit })} testId="line-unit" />
        <NumberField label="0 dBFS is" value={s.fs} onChange={(fs) => set({ fs })} unit="dBu" signed hint="Your console’s full scale; +24 dBu is common." testId="line-fs" />
        <NumberField label="Load (for watts)" value={s.sohms} onChange={(sohms) => set({ sohms })} unit="Ω" hint="Leave empty for line level." testId="line-ohms" />
      </div>
      <Result outcome={outcome} testId="line-result">
        {(r) => (
          <div className="flex flex-col gap-2">
            <div className="grid grid-cols-2 gap-x-6 gap-y-2">
              <Figure label="dBu" value={fixed(r.dBu, 2)} unit="dBu" testId="line-dbu" />
              <Figure label="dBV" value={fixed(r.dBV, 2)} unit="dBV" testId="line-dbv" />
              <Figure label="dBFS" value={fixed(r.dBFS, 2)} unit="dBFS" testId="line-dbfs" />
              <Figure label="Volts rms" value={sig(r.volts, 4)} unit="V" testId="line-volts" />
              {r.watts !== undefined && <Figure label="Into the load" value={sig(r.watts, 4)} unit="W" testId="line-watts" />}
            </div>
            {r.dBFS > 0 && <p className="text-sm text-warn">Above 0 dBFS: this console would clip.</p>}
            <p className="text-xs text-muted">+4 dBu (professional) is {fixed(proConsumerGapDb(), 2)} dB above −10 dBV (consumer).</p>
          </div>
        )}
      </Result>
    </Panel>
  );
}
