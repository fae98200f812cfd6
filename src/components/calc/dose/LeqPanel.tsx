import { leq } from '~/lib/acoustics';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { GUIDE, type DosePanelProps } from './dose-state';

/** Readings pasted from a meter: commas, spaces or new lines between them. */
function readings(text: string): string[] {
  return text.split(/[\s,;]+/).filter((x) => x !== '');
}

/** The energy average of readings at equal intervals, against the venue's limit or the WHO 100 dB LAeq,15 min. */
export default function LeqPanel({ s, set }: DosePanelProps) {
  const outcome = attempt(() => {
    const list = readings(s.readings);
    if (!list.length) throw new RangeError('Enter the readings, one per interval, separated by commas or spaces.');
    const value = leq(list.map((r, i) => num(r, `reading ${i + 1}`)));
    const limit = s.limit.trim() === '' ? undefined : num(s.limit, 'the limit');
    return { value, limit, count: list.length };
  });
  return (
    <Panel title="Average level (Leq)" guide={`${GUIDE}#average-level`} testId="leq-panel">
      <label className="flex flex-col gap-1 text-sm font-medium text-muted">
        Readings at equal intervals (e.g. one a minute)
        <textarea
          value={s.readings}
          onChange={(e) => set({ readings: e.target.value.replace(/\s+/g, ',').replace(/,+/g, ',') })}
          rows={3}
          inputMode="decimal"
          data-testid="leq-readings"
          className="rounded-lg border border-line bg-sunken p-3 text-lg tabular-nums text-fg"
        />
      </label>
      <NumberField label="Limit" value={s.limit} onChange={(limit) => set({ limit })} unit="dB" hint="The venue’s own limit, or the WHO safe-listening 100 dB LAeq over 15 min." testId="leq-limit" />
      <Result outcome={outcome} testId="leq-result">
        {({ value, limit, count }) => (
          <div className="flex flex-col gap-2">
            <Figure label={`Leq of ${count} readings`} value={fixed(value, 1)} unit="dB" big testId="leq-value" />
            {limit !== undefined && (
              <p className={`text-sm ${value > limit ? 'text-warn' : 'text-muted'}`} data-testid="leq-verdict">
                {value > limit ? `${fixed(value - limit, 1)} dB over the ${fixed(limit, 1)} dB limit.` : `${fixed(limit - value, 1)} dB under the ${fixed(limit, 1)} dB limit.`}
              </p>
            )}
          </div>
        )}
      </Result>
    </Panel>
  );
}
