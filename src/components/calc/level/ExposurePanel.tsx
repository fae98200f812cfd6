import { EXPOSURE_CAUTION, exposureLimit, type ExposureStandard } from '~/lib/acoustics';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import CopyLink from '~/components/calc/CopyLink';
import Result from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { duration } from '~/components/calc/format';
import { GUIDE, type LevelPanelProps } from './level-state';

/** Each rule is computed and shown on its own, with its criterion and exchange rate. */
const RULES: readonly { key: ExposureStandard; name: string; role: string; basis: string }[] = [
  { key: 'osha', name: 'OSHA', role: 'US legal workplace limit', basis: '90 dBA for 8 h, 5 dB exchange rate; Table G-16 ends at 115 dBA' },
  { key: 'niosh', name: 'NIOSH', role: 'US recommendation', basis: '85 dBA for 8 h, 3 dB exchange rate' },
  { key: 'eu', name: 'EU 2003/10/EC', role: 'European workplace rule', basis: 'Limit LEX,8h 87 dB(A); action values 80 and 85 dB(A)' },
];

/** Permitted daily time at a steady A-weighted level, with the caution always on screen. */
export default function ExposurePanel({ s, set }: LevelPanelProps) {
  return (
    <Panel title="Daily exposure" guide={`${GUIDE}#daily-exposure`} testId="exposure-panel">
      <NumberField label="Steady level" value={s.exp} onChange={(exp) => set({ exp })} unit="dBA" testId="exposure-level" />
      <div className="grid gap-3 sm:grid-cols-3">
        {RULES.map((rule) => (
          <div key={rule.key} className="rounded-lg border border-line p-3" data-testid={`exposure-${rule.key}`}>
            <div className="font-bold">
              {rule.name} <span className="font-normal text-muted">· {rule.role}</span>
            </div>
            <div className="text-xs text-muted">{rule.basis}</div>
            <div className="mt-2">
              <Result outcome={attempt(() => exposureLimit(num(s.exp, 'the level'), rule.key))} share={false}>
                {({ hours, notPermitted, noDailyLimit }) => (
                  <div className="text-2xl font-bold tabular-nums" data-testid={`exposure-${rule.key}-time`}>
                    {notPermitted ? (
                      <span className="text-warn">Not permitted</span>
                    ) : noDailyLimit || hours === null ? (
                      'No daily limit'
                    ) : (
                      <>
                        {duration(hours)} <span className="text-base font-medium text-muted">{rule.key === 'eu' ? 'to the limit' : 'a day'}</span>
                      </>
                    )}
                  </div>
                )}
              </Result>
            </div>
          </div>
        ))}
      </div>
      <CopyLink />
      <p className="rounded-lg bg-warn-soft p-3 text-sm text-fg" data-testid="exposure-caution">
        <strong className="text-warn">Hearing caution. </strong>
        {EXPOSURE_CAUTION}
      </p>
    </Panel>
  );
}
