import type { NodeViewProps } from '@tiptap/react';
import { LIMITS } from '~/lib/acoustics';
import { BLOCK_LIMITS, newDelayRow, type DelayBlockAttrs, type DelayRow } from '~/lib/doc/blocks/block-data';
import { delayResult } from '~/lib/doc/blocks/block-curves';
import { fixed, num } from '~/lib/doc/blocks/block-format';
import { BlockFrame, field, smallButton } from './BlockFrame';
import { NumberCell, rangeCheck } from './NumberCell';

function resultText(row: DelayRow, a: DelayBlockAttrs): string {
  try {
    const r = delayResult(row, a);
    return `Set ${fixed(r.setMs, 2)} ms = ${num(r.samples, 1)} samples${row.mode === 'distance' ? `; ±10 °C moves it ${fixed(r.driftColdMs, 2)} / ${fixed(r.driftWarmMs, 2)} ms` : ''}${r.clipped ? '. The latency is longer than the delay: set 0.' : ''}`;
  } catch (error) {
    return error instanceof RangeError ? error.message : '';
  }
}

/** The delay block in the editor: outputs with a distance or a time, and the delay each gets. */
export default function DelayBlockView({ node, updateAttributes, deleteNode }: NodeViewProps) {
  const a = node.attrs as DelayBlockAttrs;
  const set = (patch: Partial<DelayBlockAttrs>) => updateAttributes(patch);
  const setRow = (i: number, patch: Partial<DelayRow>) => set({ rows: a.rows.map((r, j) => (j === i ? { ...r, ...patch } : r)) });
  const [tMin, tMax] = a.tempUnit === 'F' ? [-76, 140] : [LIMITS.temperatureCelsius.min, LIMITS.temperatureCelsius.max];
  return (
    <BlockFrame kind="Delays" testId="delay-block" label={a.label} onLabel={(label) => set({ label })} sampleRate={a.sampleRate} onSampleRate={(sampleRate) => set({ sampleRate })} note={a.note} onNote={(note) => set({ note })} onRemove={deleteNode}>
      <div className="mt-2 flex flex-wrap items-end gap-2">
        <div className="w-24">
          <NumberCell label="Air" unit={`°${a.tempUnit}`} value={a.temperature} check={rangeCheck('Temperature', tMin, tMax)} onCommit={(temperature) => set({ temperature })} />
        </div>
        <select className={field} aria-label="Temperature unit" value={a.tempUnit} onChange={(e) => set({ tempUnit: e.target.value as 'C' | 'F' })}>
          <option value="C">°C</option>
          <option value="F">°F</option>
        </select>
      </div>
      <ol className="mt-2 flex flex-col gap-2">
        {a.rows.map((row, i) => (
          <li key={i} className="rounded-md border border-line p-2" data-testid={`delay-row-${i}`}>
            <div className="flex flex-wrap items-end gap-2">
              <label className="flex flex-col text-xs font-semibold">
                Output
                <input className={`${field} w-32`} value={row.name} maxLength={BLOCK_LIMITS.nameChars} onChange={(e) => setRow(i, { name: e.target.value })} />
              </label>
              <select className={field} aria-label="Distance or time" value={row.mode} onChange={(e) => setRow(i, { mode: e.target.value as DelayRow['mode'] })}>
                <option value="distance">Distance</option>
                <option value="time">Time</option>
              </select>
              {row.mode === 'distance' ? (
                <>
                  <div className="w-24">
                    <NumberCell label="Distance" unit={row.unit} value={row.distance} check={rangeCheck('Distance', 0, row.unit === 'ft' ? 6500 : 2000)} onCommit={(distance) => setRow(i, { distance })} testId={`delay-row-${i}-distance`} />
                  </div>
                  <select className={field} aria-label="Distance unit" value={row.unit} onChange={(e) => setRow(i, { unit: e.target.value as DelayRow['unit'] })}>
                    <option value="m">m</option>
                    <option value="ft">ft</option>
                  </select>
                </>
              ) : (
                <div className="w-24">
                  <NumberCell label="Time" unit="ms" value={row.timeMs} check={rangeCheck('Time', 0, LIMITS.delayMs.max, 'ms')} onCommit={(timeMs) => setRow(i, { timeMs })} />
                </div>
              )}
              <div className="w-20">
                <NumberCell label="Latency" unit="ms" value={row.latencyMs} check={rangeCheck('Latency', 0, 1000, 'ms')} onCommit={(latencyMs) => setRow(i, { latencyMs })} />
              </div>
              <div className="w-20">
                <NumberCell label="Offset" unit="ms" value={row.offsetMs} check={rangeCheck('Offset', 0, LIMITS.precedenceOffsetMs.max, 'ms')} onCommit={(offsetMs) => setRow(i, { offsetMs })} />
              </div>
              <button type="button" className={`${smallButton} ml-auto`} disabled={a.rows.length <= 1} onClick={() => set({ rows: a.rows.filter((_, j) => j !== i) })} aria-label={`Remove output ${i + 1}`}>
                ×
              </button>
            </div>
            <p className="mt-1 text-sm tabular-nums" data-testid={`delay-row-${i}-result`}>
              {resultText(row, a)}
            </p>
          </li>
        ))}
      </ol>
      <button type="button" className={`${smallButton} mt-2`} disabled={a.rows.length >= BLOCK_LIMITS.maxDelayRows} onClick={() => set({ rows: [...a.rows, newDelayRow(`Output ${a.rows.length + 1}`)] })}>
        Add an output
      </button>
    </BlockFrame>
  );
}
