import { useQueryState } from '~/components/calc/use-query-state';
import LoadPanel from './LoadPanel';
import MaxSplPanel from './MaxSplPanel';
import SignalLevelPanel from './SignalLevelPanel';
import { LEVELS_DEFAULTS, LEVELS_REMEMBERED } from './levels-state';

/** Line levels, amplifier loads and the loudest a system can get, each its own card. */
export default function LevelsCalculator({ search }: { search: string }) {
  const [s, set] = useQueryState(LEVELS_DEFAULTS, search, LEVELS_REMEMBERED);
  const props = { s, set };
  return (
    <div className="flex flex-col gap-4" data-testid="levels-calculator">
      <SignalLevelPanel {...props} />
      <LoadPanel {...props} />
      <MaxSplPanel {...props} />
    </div>
  );
}
