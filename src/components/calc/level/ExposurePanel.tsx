import { EXPOSURE_CAUTION, nioshRecommendedHours, oshaPermissibleHours } from '~/lib/acoustics';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { duration } from '~/components/calc/format';
import { GUIDE, type LevelPanelProps } from './level-state';

/** The two rules are computed and shown separately, each with its own criterion and exchange rate. */
const RULES = [
  { key: 'osha', name: 'OSHA', role: 'US legal workplace limit', basis: '90 dBA for 8 h, 5 dB exchange rate', hours: oshaPermissibleHours },
  { key: 'niosh', name: 'NIOSH', role: 'US recommendation', basis: '85 dBA for 8 h, 3 dB exchange rate', hours: nioshRecommendedHours },
] as const;

/** Permitted daily time at a steady A-weighted level, with the caution always on screen. */
export default function ExposurePanel({ s, set }: LevelPanelProps) {
  return (
    <Panel title="Daily exposure" guide={`${GUIDE}#daily-exposure`} testId="exposure-panel">
      <NumberField label="Steady level" value={s.exp} onChange={(exp) => set({ exp })} unit="dBA" testId="exposure-level" />
      <div className="grid gap-3 sm:grid-cols-2">
        {RULES.map((rule) => (
          <div key={rule.key} className="rounded-lg border border-line p-3" data-testid={`exposure-${rule.key}`}>
            <div className="font-bold">
              {rule.name} <span className="font-normal text-muted">· {rule.role}</span>
            </div>
            <div className="text-xs text-muted">{rule.basis}</div>
            <div className="mt-2">
              <Result outcome={attempt(() => rule.hours(num(s.exp, 'the level')))}>
                {(hours) => (
                  <div className="text-2xl font-bold tabular-nums" data-testid={`exposure-${rule.key}-time`}>
                    {duration(hours)} <span className="text-base font-medium text-muted">a day</span>
                  </div>
                )}
              </Result>
            </div>
          </div>
        ))}
      </div>
      <p className="rounded-lg bg-warn-soft p-3 text-sm text-fg" data-testid="exposure-caution">
        <strong className="text-warn">Hearing caution. </strong>
        {EXPOSURE_CAUTION}
      </p>
    </Panel>
  );
}
