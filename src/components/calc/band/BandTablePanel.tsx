import { octaveBands, type BandFraction } from '~/lib/acoustics';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { hz, sig } from '~/components/calc/format';
import { GUIDE, type BandPanelProps } from './band-state';

const FRACTIONS = [
  { value: '1', label: '1' },
  { value: '3', label: '1/3' },
  { value: '6', label: '1/6' },
  { value: '12', label: '1/12' },
  { value: '24', label: '1/24' },
] as const;

/** Fractional-octave bands per IEC 61260-1 (base 10): nominal label, exact midband, edges. */
export default function BandTablePanel({ s, set }: BandPanelProps) {
  const fraction = Number(FRACTIONS.some((f) => f.value === s.frac) ? s.frac : '3') as BandFraction;
  const outcome = attempt(() => octaveBands(fraction, num(s.bfrom, 'the lowest frequency'), num(s.bto, 'the highest frequency')));
  return (
    <Panel title="Band table" guide={`${GUIDE}#band-table`} testId="bands-panel">
      <Choice label="Band width in octaves" value={String(fraction)} onChange={(frac) => set({ frac })} options={FRACTIONS} testId="bands-fraction" />
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="From" value={s.bfrom} onChange={(bfrom) => set({ bfrom })} unit="Hz" testId="bands-from" />
        <NumberField label="To" value={s.bto} onChange={(bto) => set({ bto })} unit="Hz" testId="bands-to" />
      </div>
      <Result outcome={outcome} testId="bands-result">
        {(bands) => (
          <div className="max-h-96 overflow-auto" tabIndex={0} role="region" aria-label="Band table (scrolls)">
            <table className="w-full text-right text-sm tabular-nums" data-testid="bands-table">
              <caption className="pb-2 text-left text-muted">{bands.length} bands</caption>
              <thead className="sticky top-0 bg-sunken text-xs uppercase text-muted">
                <tr>
                  <th scope="col" className="py-1 text-left">Nominal</th>
                  <th scope="col">Exact</th>
                  <th scope="col">Low edge</th>
                  <th scope="col">High edge</th>
                </tr>
              </thead>
              <tbody>
                {bands.map((band) => (
                  <tr key={band.index} className="border-t border-line">
                    <th scope="row" className="py-1.5 text-left font-semibold">{hz(band.nominal)}</th>
                    <td>{sig(band.exact, 5)}</td>
                    <td>{sig(band.low, 5)}</td>
                    <td>{sig(band.high, 5)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </Result>
    </Panel>
  );
}
