import { backgroundCorrection, backgroundWarning } from '~/lib/acoustics';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { GUIDE, type LevelPanelProps } from './level-state';

/** The source alone from a reading with it and one without it. */
export default function BackgroundPanel({ s, set }: LevelPanelProps) {
  const outcome = attempt(() => {
    const total = num(s.total, 'the level with the source on');
    const background = num(s.bg, 'the background level');
    return { total, source: backgroundCorrection(total, background), warning: backgroundWarning(total, background) };
  });
  return (
    <Panel title="Background noise" guide={`${GUIDE}#background-noise`} testId="background-panel">
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Source on" value={s.total} onChange={(total) => set({ total })} unit="dB" signed testId="background-total" />
        <NumberField label="Source off" value={s.bg} onChange={(bg) => set({ bg })} unit="dB" signed testId="background-bg" />
      </div>
      <Result outcome={outcome} testId="background-result">
        {({ total, source, warning }) => (
          <div className="flex flex-col gap-2">
            <div className="flex gap-6">
              <Figure label="Source alone" value={fixed(source, 1)} unit="dB" big testId="background-source" />
              <Figure label="Correction" value={fixed(source - total, 1)} unit="dB" />
            </div>
            {warning && (
              <p className="text-sm text-warn" data-testid="background-warning">
                {warning}
              </p>
            )}
          </div>
        )}
      </Result>
    </Panel>
  );
}
