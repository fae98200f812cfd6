import { celsiusFromTyped, speedOfSound } from '~/lib/acoustics';
import { attempt, num } from '~/components/calc/attempt';
import { useQueryState } from '~/components/calc/use-query-state';
import AirPanel from './AirPanel';
import FillPanel from './FillPanel';
import SubTopPanel from './SubTopPanel';
import TravelPanel from './TravelPanel';
import { DELAY_DEFAULTS, DELAY_REMEMBERED } from './delay-state';

/** Delay and alignment: one air temperature and one set of units feed every panel. */
export default function DelayCalculator({ search }: { search: string }) {
  const [s, set] = useQueryState(DELAY_DEFAULTS, search, DELAY_REMEMBERED);
  const air = attempt(() => {
    // Checked in the unit typed, so 150 °F is refused in °F.
    const celsius = celsiusFromTyped(num(s.temp, 'the air temperature'), s.tempUnit);
    const rh = (s.rh ?? '').trim() === '' ? undefined : num(s.rh, 'the relative humidity');
    return { celsius, rh, speed: speedOfSound(celsius, rh) };
  });
  const props = { s, set, air };
  return (
    <div className="flex flex-col gap-4" data-testid="delay-calculator">
      <AirPanel {...props} />
      <TravelPanel {...props} />
      <FillPanel {...props} />
      <SubTopPanel {...props} />
    </div>
  );
}
