import type { NodeViewProps } from '@tiptap/react';
import { LIMITS, usualHighPolarity, type CrossoverFamily } from '~/lib/acoustics';
import { BLOCK_LIMITS, type CrossoverBlockAttrs, type XoverEdge, type XoverWay } from '~/lib/doc/blocks/block-data';
import { crossoverPlotSvg } from '~/lib/doc/render-blocks';
import { BlockFrame, field, smallButton } from './BlockFrame';
import { LivePlot } from './LivePlot';
import { NumberCell, rangeCheck } from './NumberCell';
import { TracePanel } from './TracePanel';

function EdgeFields({ title, edge, onChange, top, testId }: { title: string; edge: XoverEdge | null; onChange: (e: XoverEdge | null) => void; top: number; testId: string }) {
  const slopes: readonly number[] = edge ? LIMITS.crossoverSlopesDbPerOctave[edge.family] : [];
  return (
    <fieldset className="flex flex-wrap items-end gap-2 rounded-md border border-line p-2">
      <legend className="px-1 text-xs font-semibold">{title}</legend>
      <label className="flex flex-col text-xs font-semibold">
        Filter
        <select
          className={field}
          value={edge ? edge.family : 'none'}
          data-testid={`${testId}-family`}
          onChange={(e) => {
            const family = e.target.value;
            if (family === 'none') return onChange(null);
            const allowed: readonly number[] = LIMITS.crossoverSlopesDbPerOctave[family as CrossoverFamily];
            onChange({ family: family as CrossoverFamily, slope: edge && allowed.includes(edge.slope) ? edge.slope : 24, freq: edge?.freq ?? 100 });
          }}
        >
          <option value="none">None</option>
          <option value="linkwitz-riley">Linkwitz-Riley</option>
          <option value="butterworth">Butterworth</option>
        </select>
      </label>
      {edge && (
        <>
          <label className="flex flex-col text-xs font-semibold">
            Slope
            <select className={field} value={edge.slope} onChange={(e) => onChange({ ...edge, slope: Number(e.target.value) })}>
              {slopes.map((s) => (
                <option key={s} value={s}>
                  {s} dB/oct
                </option>
              ))}
            </select>
          </label>
          <div className="w-24">
            <NumberCell label="Freq" unit="Hz" value={edge.freq} check={(n) => (n < 1 || n >= top ? `Frequency must be from 1 Hz to below ${top} Hz.` : null)} onCommit={(freq) => onChange({ ...edge, freq })} testId={`${testId}-freq`} />
          </div>
        </>
      )}
    </fieldset>
  );
}

/** The crossover block in the editor: each way's edges, gain, polarity and delay, with the ways and their sum drawn live. */
export default function CrossoverBlockView({ node, updateAttributes, deleteNode }: NodeViewProps) {
  const a = node.attrs as CrossoverBlockAttrs;
  const set = (patch: Partial<CrossoverBlockAttrs>) => updateAttributes(patch);
  const setWay = (i: number, patch: Partial<XoverWay>) => set({ ways: a.ways.map((w, j) => (j === i ? { ...w, ...patch } : w)) });
  const top = Math.floor(BLOCK_LIMITS.maxFractionOfFs * a.sampleRate);
  return (
    <BlockFrame kind="Crossover" testId="crossover-block" label={a.label} onLabel={(label) => set({ label })} sampleRate={a.sampleRate} onSampleRate={(sampleRate) => set({ sampleRate })} note={a.note} onNote={(note) => set({ note })} onRemove={deleteNode}>
      <LivePlot draw={() => crossoverPlotSvg(a, 'edit-x')} deps={node.attrs} />
      <ol className="flex flex-col gap-2">
        {a.ways.map((way, i) => (
          <li key={i} className="rounded-md border border-line p-2" data-testid={`way-${i}`}>
            <div className="flex flex-wrap items-end gap-2">
              <label className="flex flex-col text-xs font-semibold">
                Way
                <input className={`${field} w-28`} value={way.name} maxLength={BLOCK_LIMITS.nameChars} onChange={(e) => setWay(i, { name: e.target.value })} />
              </label>
              <div className="w-20">
                <NumberCell label="Gain" unit="dB" value={way.gain} check={rangeCheck('Gain', LIMITS.gainDb.min, LIMITS.gainDb.max, 'dB')} onCommit={(gain) => setWay(i, { gain })} />
              </div>
              <div className="w-24">
                <NumberCell label="Delay" unit="ms" value={way.delayMs} check={rangeCheck('Delay', 0, LIMITS.delayMs.max, 'ms')} onCommit={(delayMs) => setWay(i, { delayMs })} testId={`way-${i}-delay`} />
              </div>
              <label className="flex flex-col text-xs font-semibold">
                Polarity
                <select className={field} value={way.polarity} onChange={(e) => setWay(i, { polarity: e.target.value as XoverWay['polarity'] })} data-testid={`way-${i}-polarity`}>
                  <option value="normal">Normal</option>
                  <option value="inverted">Inverted</option>
                </select>
              </label>
              <button type="button" className={`${smallButton} ml-auto`} disabled={a.ways.length <= BLOCK_LIMITS.minWays} onClick={() => set({ ways: a.ways.filter((_, j) => j !== i) })} aria-label={`Remove way ${i + 1}`}>
                ×
              </button>
            </div>
            <div className="mt-2 grid gap-2 sm:grid-cols-2">
              <EdgeFields title="High-pass (bottom of the way)" edge={way.highPass} onChange={(highPass) => setWay(i, { highPass })} top={top} testId={`way-${i}-hp`} />
              <EdgeFields title="Low-pass (top of the way)" edge={way.lowPass} onChange={(lowPass) => setWay(i, { lowPass })} top={top} testId={`way-${i}-lp`} />
            </div>
            {way.highPass && usualHighPolarity(way.highPass.family, way.highPass.slope) === 'inverted' && way.polarity === 'normal' && (
              <p className="mt-1 text-xs text-warn">An odd-order Linkwitz-Riley high side is usually wired inverted; with both normal the sum nulls at the crossover.</p>
            )}
          </li>
        ))}
      </ol>
      <button
        type="button"
        className={`${smallButton} mt-2`}
        disabled={a.ways.length >= BLOCK_LIMITS.maxWays}
        onClick={() => set({ ways: [...a.ways, { name: `Way ${a.ways.length + 1}`, highPass: { family: 'linkwitz-riley', slope: 24, freq: 1200 }, lowPass: null, gain: 0, polarity: 'normal', delayMs: 0 }] })}
      >
        Add a way
      </button>
      <TracePanel traces={a.traces} compare={a.compare} onChange={(patch) => set(patch)} testId="crossover-block" />
    </BlockFrame>
  );
}
