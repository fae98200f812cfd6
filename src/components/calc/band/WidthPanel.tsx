import { solveBand, type BandInput } from '~/lib/acoustics';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { sig } from '~/components/calc/format';
import { GUIDE, type BandPanelProps } from './band-state';

const STARTS = [
  { value: 'q', label: 'Q' },
  { value: 'oct', label: 'Octaves' },
  { value: 'edges', label: 'Edges' },
] as const;

/** Q ↔ octaves, and with a centre frequency the −3 dB edges; or the other way round from the edges. */
export default function WidthPanel({ s, set }: BandPanelProps) {
  const start = STARTS.some((o) => o.value === s.start) ? s.start : 'q';
  const outcome = attempt(() => {
    if (start === 'edges') return solveBand({ low: num(s.low, 'the lower edge'), high: num(s.high, 'the upper edge') });
    const width = start === 'q' ? { q: num(s.q, 'Q') } : { octaves: num(s.oct, 'the width in octaves', true) };
    // An empty centre is allowed: Q and octaves convert without knowing where the band sits.
    const hasCentre = s.f0.trim() !== '';
    return solveBand((hasCentre ? { ...width, f0: num(s.f0, 'the centre frequency') } : width) as BandInput);
  });
  return (
    <Panel title="Width and edges" guide={`${GUIDE}#width-and-edges`} testId="width-panel">
      <Choice label="Start from" value={start} onChange={(v) => set({ start: v })} options={STARTS} testId="width-start" />
      {start === 'edges' ? (
        <div className="grid grid-cols-2 gap-3">
          <NumberField label="Lower edge (−3 dB)" value={s.low} onChange={(low) => set({ low })} unit="Hz" testId="width-low" />
          <NumberField label="Upper edge (−3 dB)" value={s.high} onChange={(high) => set({ high })} unit="Hz" testId="width-high" />
        </div>
      ) : (
        <div className="grid grid-cols-2 gap-3">
          {start === 'q' ? (
            <NumberField label="Q" value={s.q} onChange={(q) => set({ q })} testId="width-q" />
          ) : (
            <NumberField label="Width" value={s.oct} onChange={(oct) => set({ oct })} unit="oct" hint="A decimal or a fraction such as 1/3." testId="width-oct" />
          )}
          <NumberField label="Centre (optional)" value={s.f0} onChange={(f0) => set({ f0 })} unit="Hz" testId="width-f0" />
        </div>
      )}
      <Result outcome={outcome} testId="width-result">
        {(band) => (
          <div className="grid grid-cols-2 gap-x-6 gap-y-2 sm:grid-cols-3">
            <Figure label="Q" value={sig(band.q, 4)} big={start !== 'q'} testId="width-q-result" />
            <Figure label="Width" value={sig(band.octaves, 4)} unit="oct" big={start === 'q'} testId="width-oct-result" />
            {band.f0 !== undefined && <Figure label="Centre" value={sig(band.f0, 5)} unit="Hz" testId="width-f0-result" />}
            {band.low !== undefined && <Figure label="Lower edge" value={sig(band.low, 5)} unit="Hz" testId="width-low-result" />}
            {band.high !== undefined && <Figure label="Upper edge" value={sig(band.high, 5)} unit="Hz" testId="width-high-result" />}
            {band.bandwidthHz !== undefined && <Figure label="Bandwidth" value={sig(band.bandwidthHz, 5)} unit="Hz" testId="width-bw-result" />}
          </div>
        )}
      </Result>
    </Panel>
  );
}
