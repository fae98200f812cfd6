import { combFilter, metersFromTyped } from '~/lib/acoustics';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { hz } from '~/components/calc/format';
import { GUIDE, type WavesPanelProps } from './waves-state';

/** Shown on a phone: the first few nulls say what the ear hears; the rest follow at the same spacing. */
const SHOWN = 8;

/** Where two equal arrivals cancel and add, from their time or path difference. */
export default function CombPanel({ s, set, air }: WavesPanelProps) {
  const byTime = s.cmode !== 'distance';
  const outcome = attempt(() => {
    if (!air.ok) throw new RangeError(air.message);
    const ms = byTime ? num(s.cms, 'the time difference') : (metersFromTyped(num(s.cdist, 'the path difference'), s.unit, 'The path difference', true) / air.value.speed) * 1000;
    return { ...combFilter(ms), ms };
  });
  return (
    <Panel title="Comb filter" guide={`${GUIDE}#comb-filter`} testId="comb-panel">
      <Choice label="From" value={byTime ? 'time' : 'distance'} onChange={(cmode) => set({ cmode })} options={[{ value: 'time', label: 'Time' }, { value: 'distance', label: 'Path difference' }]} testId="comb-mode" />
      {byTime ? (
        <NumberField label="Time between arrivals" value={s.cms} onChange={(cms) => set({ cms })} unit="ms" testId="comb-ms" />
      ) : (
        <NumberField label="Path difference" value={s.cdist} onChange={(cdist) => set({ cdist })} unit={s.unit} testId="comb-distance" />
      )}
      <Result outcome={outcome} testId="comb-result">
        {(r) => (
          <div className="flex flex-col gap-2">
            <Figure label="First null" value={r.nulls.length ? hz(r.nulls[0]!) : '—'} unit="Hz" big testId="comb-first-null" />
            <div className="text-sm" data-testid="comb-nulls">
              <span className="text-muted">Nulls: </span>
              {r.nulls.slice(0, SHOWN).map(hz).join(', ')}
              {r.nulls.length > SHOWN ? ` … every ${hz(r.spacingHz)} Hz` : ''}
            </div>
            <div className="text-sm" data-testid="comb-peaks">
              <span className="text-muted">Peaks: </span>
              {r.peaks.slice(0, SHOWN).map(hz).join(', ')}
              {r.peaks.length > SHOWN ? ' …' : ''}
            </div>
          </div>
        )}
      </Result>
    </Panel>
  );
}
