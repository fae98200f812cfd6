import { LIMITS, speakerLoad, type Wiring } from '~/lib/acoustics';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { sig } from '~/components/calc/format';
import { GUIDE, type LevelsPanelProps } from './levels-state';

const MAX_ROWS = Math.min(8, LIMITS.maxBoxes);

/** The nominal load a channel sees, against the amplifier's minimum. */
export default function LoadPanel({ s, set }: LevelsPanelProps) {
  const loads = s.loads.split(',').slice(0, MAX_ROWS);
  const write = (next: string[]) => set({ loads: next.map((v) => v.replace(',', '.')).join(',') });
  const outcome = attempt(() => {
    const min = s.minload.trim() === '' ? undefined : num(s.minload, 'the amplifier’s minimum load');
    return speakerLoad(loads.map((v, i) => num(v, `box ${i + 1}`)), s.wiring as Wiring, min);
  });
  return (
    <Panel title="Loudspeaker load" guide={`${GUIDE}#loudspeaker-load`} testId="load-panel">
      <Choice label="Wired in" value={s.wiring} onChange={(wiring) => set({ wiring })} options={[{ value: 'parallel', label: 'Parallel' }, { value: 'series', label: 'Series' }]} testId="load-wiring" />
      <ol className="grid grid-cols-2 gap-2">
        {loads.map((r, i) => (
          <li key={i} className="flex items-end gap-1">
            <div className="min-w-0 flex-1">
              <NumberField label={`Box ${i + 1}`} value={r} onChange={(v) => write(loads.map((x, j) => (j === i ? v : x)))} unit="Ω" testId={`load-${i}`} />
            </div>
            <button type="button" aria-label={`Remove box ${i + 1}`} disabled={loads.length <= 1} onClick={() => write(loads.filter((_, j) => j !== i))} className="h-12 w-11 shrink-0 rounded-lg border border-line text-xl disabled:opacity-40">
              −
            </button>
          </li>
        ))}
      </ol>
      <button type="button" disabled={loads.length >= MAX_ROWS} onClick={() => write([...loads, loads[loads.length - 1] ?? '8'])} className="min-h-12 rounded-lg border border-line px-4 font-semibold disabled:opacity-40" data-testid="load-add">
        Add a box
      </button>
      <NumberField label="Amplifier’s minimum load" value={s.minload} onChange={(minload) => set({ minload })} unit="Ω" testId="load-min" />
      <Result outcome={outcome} testId="load-result">
        {(r) => (
          <div className="flex flex-col gap-2">
            <Figure label="Load on the channel" value={sig(r.ohms, 3)} unit="Ω" big testId="load-ohms" />
            {r.warning && (
              <p className="rounded-lg bg-warn-soft p-2 text-sm text-warn" data-testid="load-warning">
                {r.warning}
              </p>
            )}
            <p className="text-xs text-muted">Nominal figures: a loudspeaker’s real impedance dips below its rating at some frequencies.</p>
          </div>
        )}
      </Result>
    </Panel>
  );
}
