import type { NodeViewProps } from '@tiptap/react';
import { LIMITS } from '~/lib/acoustics';
import { BAND_TYPE_LABELS, BLOCK_LIMITS, hasGain, isShelf, newBand, type BandType, type EqBand, type EqBlockAttrs } from '~/lib/doc/blocks/block-data';
import { bandWidths } from '~/lib/doc/blocks/block-curves';
import { num } from '~/lib/doc/blocks/block-format';
import { eqPlotSvg, Q_CONVENTION } from '~/lib/doc/render-blocks';
import { BlockFrame, field, smallButton } from './BlockFrame';
import { LivePlot } from './LivePlot';
import { NumberCell, rangeCheck } from './NumberCell';
import { TracePanel } from './TracePanel';

function widthText(band: EqBand, rate: number): string {
  try {
    const w = bandWidths(band, rate);
    if (w.nominalOctaves === null) return '';
    return w.digitalOctaves === null ? `${num(w.nominalOctaves, 2)} oct` : `${num(w.nominalOctaves, 2)} oct (${num(w.digitalOctaves, 2)} at this rate)`;
  } catch {
    return '';
  }
}

/** The EQ block in the editor: a compact band table and the live curve. */
export default function EqBlockView({ node, updateAttributes, deleteNode }: NodeViewProps) {
  const a = node.attrs as EqBlockAttrs;
  const set = (patch: Partial<EqBlockAttrs>) => updateAttributes(patch);
  const setBands = (bands: EqBand[]) => set({ bands });
  const setBand = (i: number, patch: Partial<EqBand>) => setBands(a.bands.map((b, j) => (j === i ? { ...b, ...patch } : b)));
  const move = (i: number, by: number) => {
    const bands = [...a.bands];
    const [band] = bands.splice(i, 1);
    bands.splice(i + by, 0, band!);
    setBands(bands);
  };
  const top = Math.floor(BLOCK_LIMITS.maxFractionOfFs * a.sampleRate);
  const freqCheck = (n: number) => (n < 1 || n >= top ? `Frequency must be from 1 Hz to below ${top} Hz (0.49 × the sample rate).` : null);
  return (
    <BlockFrame
      kind="EQ"
      testId="eq-block"
      label={a.label}
      onLabel={(label) => set({ label })}
      sampleRate={a.sampleRate}
      onSampleRate={(sampleRate) => set({ sampleRate })}
      note={a.note}
      onNote={(note) => set({ note })}
      onRemove={deleteNode}
    >
      <LivePlot draw={() => eqPlotSvg(a, 'edit-eq')} deps={node.attrs} />
      <p className="text-xs text-muted">{Q_CONVENTION}</p>
      <ol className="mt-2 flex flex-col gap-2">
        {a.bands.map((band, i) => (
          <li key={i} className={`rounded-md border border-line p-2 ${band.on ? '' : 'opacity-60'}`} data-testid={`eq-band-${i}`}>
            <div className="flex flex-wrap items-end gap-2">
              <span className="min-w-6 pb-3 text-sm font-bold">{i + 1}</span>
              <label className="flex flex-col text-xs font-semibold">
                Type
                <select className={field} value={band.type} onChange={(e) => setBand(i, { type: e.target.value as BandType, q: isShelf(e.target.value as BandType) ? Math.min(band.q, 1) : band.q })} data-testid={`eq-band-${i}-type`}>
                  {Object.entries(BAND_TYPE_LABELS).map(([value, text]) => (
                    <option key={value} value={value}>
                      {text}
                    </option>
                  ))}
                </select>
              </label>
              <div className="w-24">
                <NumberCell label="Freq" unit="Hz" value={band.freq} check={freqCheck} onCommit={(freq) => setBand(i, { freq })} testId={`eq-band-${i}-freq`} />
              </div>
              {hasGain(band.type) && (
                <div className="w-20">
                  <NumberCell label="Gain" unit="dB" value={band.gain} check={rangeCheck('Gain', LIMITS.gainDb.min, LIMITS.gainDb.max, 'dB')} onCommit={(gain) => setBand(i, { gain })} testId={`eq-band-${i}-gain`} />
                </div>
              )}
              <div className="w-20">
                <NumberCell
                  label={isShelf(band.type) ? 'S' : 'Q'}
                  value={band.q}
                  check={isShelf(band.type) ? rangeCheck('Slope S', LIMITS.shelfSlope.min, LIMITS.shelfSlope.max) : rangeCheck('Q', LIMITS.q.min, LIMITS.q.max)}
                  onCommit={(q) => setBand(i, { q })}
                  testId={`eq-band-${i}-q`}
                />
              </div>
              <label className="flex min-h-11 items-center gap-1 text-sm">
                <input type="checkbox" className="h-5 w-5" checked={band.on} onChange={(e) => setBand(i, { on: e.target.checked })} data-testid={`eq-band-${i}-on`} />
                On
              </label>
              <div className="ml-auto flex gap-1">
                <button type="button" className={smallButton} disabled={i === 0} onClick={() => move(i, -1)} aria-label={`Move band ${i + 1} up`}>
                  ↑
                </button>
                <button type="button" className={smallButton} disabled={i === a.bands.length - 1} onClick={() => move(i, 1)} aria-label={`Move band ${i + 1} down`}>
                  ↓
                </button>
                <button type="button" className={smallButton} onClick={() => setBands(a.bands.filter((_, j) => j !== i))} aria-label={`Remove band ${i + 1}`}>
                  ×
                </button>
              </div>
            </div>
            <p className="mt-1 text-xs text-muted">{widthText(band, a.sampleRate)}</p>
          </li>
        ))}
      </ol>
      <div className="mt-2 flex flex-wrap items-end gap-2">
        <button type="button" className={smallButton} disabled={a.bands.length >= BLOCK_LIMITS.maxBands} onClick={() => setBands([...a.bands, newBand()])} data-testid="eq-add-band">
          Add a band
        </button>
        <div className="w-24">
          <NumberCell label="Output" unit="dB" value={a.outputGain} check={rangeCheck('Output gain', BLOCK_LIMITS.outputGainDb.min, BLOCK_LIMITS.outputGainDb.max, 'dB')} onCommit={(outputGain) => set({ outputGain })} />
        </div>
        <label className="flex flex-col text-xs font-semibold">
          Polarity
          <select className={field} value={a.polarity} onChange={(e) => set({ polarity: e.target.value as EqBlockAttrs['polarity'] })}>
            <option value="normal">Normal</option>
            <option value="inverted">Inverted</option>
          </select>
        </label>
      </div>
      <TracePanel traces={a.traces} compare={a.compare} onChange={(patch) => set(patch)} testId="eq-block" />
    </BlockFrame>
  );
}
