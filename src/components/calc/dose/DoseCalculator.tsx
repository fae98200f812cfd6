import { useQueryState } from '~/components/calc/use-query-state';
import DosePanel from './DosePanel';
import LeqPanel from './LeqPanel';
import { DOSE_DEFAULTS } from './dose-state';

/** A working day as a dose under each rule, and the audience's average level over a window. */
export default function DoseCalculator({ search }: { search: string }) {
  const [s, set] = useQueryState(DOSE_DEFAULTS, search);
  const props = { s, set };
  return (
    <div className="flex flex-col gap-4" data-testid="dose-calculator">
      <DosePanel {...props} />
      <LeqPanel {...props} />
    </div>
  );
}
