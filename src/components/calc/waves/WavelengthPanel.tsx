import { lengthFromMeters, wavelength } from '~/lib/acoustics';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { sig } from '~/components/calc/format';
import { GUIDE, type WavesPanelProps } from './waves-state';

/** λ = c/f at today's air. */
export default function WavelengthPanel({ s, set, air }: WavesPanelProps) {
  const outcome = attempt(() => {
    if (!air.ok) throw new RangeError(air.message);
    return wavelength(num(s.wfreq, 'the frequency'), air.value.celsius, air.value.rh);
  });
  return (
    <Panel title="Wavelength" guide={`${GUIDE}#wavelength`} testId="wavelength-panel">
      <NumberField label="Frequency" value={s.wfreq} onChange={(wfreq) => set({ wfreq })} unit="Hz" testId="wavelength-freq" />
      <Result outcome={outcome} testId="wavelength-result">
        {(r) => (
          <div className="flex flex-wrap gap-x-6 gap-y-2">
            <Figure label="Wavelength" value={sig(lengthFromMeters(r.meters, s.unit), 4)} unit={s.unit} big testId="wavelength-value" />
            <Figure label="Quarter" value={sig(lengthFromMeters(r.meters / 4, s.unit), 4)} unit={s.unit} />
          </div>
        )}
      </Result>
    </Panel>
  );
}
