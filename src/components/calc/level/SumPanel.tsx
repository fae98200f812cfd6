import { LIMITS, coherentTotal, incoherentSum } from '~/lib/acoustics';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { GUIDE, type LevelPanelProps } from './level-state';

/** Rows on screen stay few enough to scroll past with a thumb; the math accepts LIMITS.maxLevels. */
const MAX_ROWS = Math.min(16, LIMITS.maxLevels);

/** Adds levels by power (unrelated sources) or by pressure with phases (the same signal). */
export default function SumPanel({ s, set }: LevelPanelProps) {
  const levels = s.levels.split(',').slice(0, MAX_ROWS);
  const phases = levels.map((_, i) => s.phases.split(',')[i] ?? '0');
  const coherent = s.mode === 'coherent';
  // Commas separate rows in the link, so a decimal comma typed in a row becomes a point.
  const write = (nextLevels: string[], nextPhases: string[]) =>
    set({ levels: nextLevels.map((v) => v.replace(',', '.')).join(','), phases: nextPhases.map((v) => v.replace(',', '.')).join(',') });
  const edit = (list: string[], i: number, value: string) => list.map((v, j) => (j === i ? value : v));
  const outcome = attempt(() => {
    const values = levels.map((v, i) => num(v, `level ${i + 1}`));
    return coherent ? coherentTotal(values, phases.map((p, i) => num(p, `phase ${i + 1}`))) : { totalDb: incoherentSum(values), isNull: false };
  });
  return (
    <Panel title="Adding sources" guide={`${GUIDE}#adding-sources`} testId="sum-panel">
      <Choice label="Sources" value={s.mode} onChange={(mode) => set({ mode })} options={[{ value: 'incoherent', label: 'Unrelated' }, { value: 'coherent', label: 'Same signal' }]} testId="sum-mode" />
      <ol className="flex flex-col gap-2">
        {levels.map((level, i) => (
          <li key={i} className="flex items-end gap-2">
            <div className="flex-1">
              <NumberField label={`Level ${i + 1}`} value={level} onChange={(v) => write(edit(levels, i, v), phases)} unit="dB" signed testId={`sum-level-${i}`} />
            </div>
            {coherent && (
              <div className="w-28">
                <NumberField label="Phase" value={phases[i]} onChange={(v) => write(levels, edit(phases, i, v))} unit="°" signed testId={`sum-phase-${i}`} />
              </div>
            )}
            <button
              type="button"
              aria-label={`Remove level ${i + 1}`}
              disabled={levels.length <= 1}
              onClick={() => write(levels.filter((_, j) => j !== i), phases.filter((_, j) => j !== i))}
              className="h-12 w-12 shrink-0 rounded-lg border border-line text-xl disabled:opacity-40"
            >
              −
            </button>
          </li>
        ))}
      </ol>
      <button
        type="button"
        disabled={levels.length >= MAX_ROWS}
        onClick={() => write([...levels, levels[levels.length - 1] ?? '90'], [...phases, '0'])}
        className="min-h-12 rounded-lg border border-line px-4 font-semibold disabled:opacity-40"
      >
        Add a source
      </button>
      <Result outcome={outcome} testId="sum-result">
        {({ totalDb, isNull }) =>
          isNull ? (
            <div>
              <Figure label="Total (same signal)" value="Null" big testId="sum-total" />
              <p className="text-sm text-muted" data-testid="sum-null">
                The sources cancel completely at this frequency: no level at all here, in theory. In a room, reflections and small level or phase differences leave a deep dip instead.
              </p>
            </div>
          ) : (
            <Figure label={coherent ? 'Total (same signal)' : 'Total (unrelated)'} value={fixed(totalDb, 1)} unit="dB" big testId="sum-total" />
          )
        }
      </Result>
    </Panel>
  );
}
