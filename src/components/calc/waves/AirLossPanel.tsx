import { airAbsorption, exactMidbandHz, metersFromTyped, tabulatedFrequency } from '~/lib/acoustics';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { GUIDE, type WavesPanelProps } from './waves-state';

/** Octave bands shown beside the chosen frequency, at their exact base-10 midbands as ISO 9613-1 asks. */
const OCTAVES = [-4, -3, -2, -1, 0, 1, 2, 3].map((x) => exactMidbandHz(x, 1));
const NOMINAL = ['63', '125', '250', '500', '1k', '2k', '4k', '8k'];

/** What the air takes away over the throw, per ISO 9613-1. */
export default function AirLossPanel({ s, set, air }: WavesPanelProps) {
  const outcome = attempt(() => {
    if (!air.ok) throw new RangeError(air.message);
    const at = tabulatedFrequency(num(s.afreq, 'the frequency'));
    const d = metersFromTyped(num(s.adist, 'the distance'), s.unit);
    return { at, chosen: airAbsorption(at.frequencyHz, d, air.value.celsius, air.value.rh), bands: OCTAVES.map((f) => airAbsorption(f, d, air.value.celsius, air.value.rh).attenuationDb) };
  });
  return (
    <Panel title="Air absorption" guide={`${GUIDE}#air-absorption`} testId="airloss-panel">
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Frequency" value={s.afreq} onChange={(afreq) => set({ afreq })} unit="Hz" testId="airloss-freq" />
        <NumberField label="Throw" value={s.adist} onChange={(adist) => set({ adist })} unit={s.unit} testId="airloss-distance" />
      </div>
      <Result outcome={outcome} testId="airloss-result">
        {({ at, chosen, bands }) => (
          <div className="flex flex-col gap-2">
            <div className="flex flex-wrap gap-x-6 gap-y-2">
              <Figure label="Lost to the air" value={fixed(chosen.attenuationDb, 1)} unit="dB" big testId="airloss-db" />
              <Figure label="Per km" value={fixed(chosen.perKmDb, 1)} unit="dB/km" testId="airloss-perkm" />
            </div>
            {at.nominalHz !== undefined && (
              <p className="text-sm text-muted" data-testid="airloss-exact">
                {at.nominalHz} Hz is a nominal band frequency: computed at the exact {at.frequencyHz.toPrecision(5)} Hz, as ISO 9613-1 specifies for bands.
              </p>
            )}
            <table className="w-full text-sm tabular-nums">
              <tbody>
                <tr className="text-muted">{NOMINAL.map((n) => <td key={n}>{n}</td>)}</tr>
                <tr>{bands.map((db, i) => <td key={i}>{fixed(db, 1)}</td>)}</tr>
              </tbody>
            </table>
            <p className="text-xs text-muted">dB lost over this throw per octave band, on top of the distance loss.</p>
          </div>
        )}
      </Result>
    </Panel>
  );
}
