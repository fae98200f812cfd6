import { useQueryState } from '~/components/calc/use-query-state';
import BackgroundPanel from './BackgroundPanel';
import DistancePanel from './DistancePanel';
import ExposurePanel from './ExposurePanel';
import SumPanel from './SumPanel';
import WeightingPanel from './WeightingPanel';
import { LEVEL_DEFAULTS, LEVEL_REMEMBERED } from './level-state';

/** Sound level: sums, distance, background, weighting and exposure, each its own card. */
export default function LevelCalculator({ search }: { search: string }) {
  const [s, set] = useQueryState(LEVEL_DEFAULTS, search, LEVEL_REMEMBERED);
  const props = { s, set };
  return (
    <div className="flex flex-col gap-4" data-testid="level-calculator">
      <SumPanel {...props} />
      <DistancePanel {...props} />
      <BackgroundPanel {...props} />
      <WeightingPanel {...props} />
      <ExposurePanel {...props} />
    </div>
  );
}
