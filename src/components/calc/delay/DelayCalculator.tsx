import { celsiusFromFahrenheit, speedOfSound } from '~/lib/acoustics';
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
    const typed = num(s.temp, 'the air temperature');
    const celsius = s.tempUnit === 'F' ? celsiusFromFahrenheit(typed) : typed;
    return { celsius, speed: speedOfSound(celsius) };
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
