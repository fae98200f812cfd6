import { levelAtDistance } from '~/lib/acoustics';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { convertText, lengthTo, toMeters } from '~/components/calc/unit-switch';
import { GUIDE, type LevelPanelProps } from './level-state';

/** Level at a new distance from a point or line source, in metres or feet. */
export default function DistancePanel({ s, set }: LevelPanelProps) {
  const switchUnit = (unit: string) => {
    if (unit !== s.unit) set({ unit, from: convertText(s.from, lengthTo(unit)), to: convertText(s.to, lengthTo(unit)) });
  };
  const outcome = attempt(() =>
    levelAtDistance(
      num(s.level, 'the measured level'),
      toMeters(num(s.from, 'the measured distance'), s.unit),
      toMeters(num(s.to, 'the new distance'), s.unit),
      s.source === 'line' ? 'line' : 'point',
    ),
  );
  return (
    <Panel title="Over distance" guide={`${GUIDE}#over-distance`} testId="distance-panel">
      <NumberField label="Measured level" value={s.level} onChange={(level) => set({ level })} unit="dB" signed testId="distance-level" />
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Measured at" value={s.from} onChange={(from) => set({ from })} unit={s.unit} testId="distance-from" />
        <NumberField label="New distance" value={s.to} onChange={(to) => set({ to })} unit={s.unit} testId="distance-to" />
        <Choice label="Source" value={s.source} onChange={(source) => set({ source })} options={[{ value: 'point', label: 'Point' }, { value: 'line', label: 'Line' }]} testId="distance-source" />
        <Choice label="Distances in" value={s.unit} onChange={switchUnit} options={[{ value: 'm', label: 'm' }, { value: 'ft', label: 'ft' }]} testId="distance-unit" />
      </div>
      <Result outcome={outcome} testId="distance-result">
        {({ levelDb, changeDb }) => (
          <div className="flex gap-6">
            <Figure label="Level there" value={fixed(levelDb, 1)} unit="dB" big testId="distance-new-level" />
            <Figure label="Change" value={`${changeDb > 0 ? '+' : ''}${fixed(changeDb, 1)}`} unit="dB" />
          </div>
        )}
      </Result>
    </Panel>
  );
}
