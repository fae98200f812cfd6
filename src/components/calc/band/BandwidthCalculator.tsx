import { useQueryState } from '~/components/calc/use-query-state';
import BandTablePanel from './BandTablePanel';
import NotePanel from './NotePanel';
import WidthPanel from './WidthPanel';
import { BAND_DEFAULTS } from './band-state';

/** Band and Q: width conversions, the fractional-octave band table and the note finder. */
export default function BandwidthCalculator({ search }: { search: string }) {
  const [s, set] = useQueryState(BAND_DEFAULTS, search);
  return (
    <div className="flex flex-col gap-4" data-testid="band-calculator">
      <WidthPanel s={s} set={set} />
      <NotePanel s={s} set={set} />
      <BandTablePanel s={s} set={set} />
    </div>
  );
}
