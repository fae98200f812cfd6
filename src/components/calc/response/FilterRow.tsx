import { LIMITS } from '~/lib/acoustics';
import NumberField from '~/components/calc/NumberField';
import SelectField from '~/components/calc/SelectField';
import { clean, kindOf, retype, type FilterDraft } from './filter-draft';

const TYPES = [
  { value: 'peaking', label: 'Bell (peaking)' },
  { value: 'lowshelf', label: 'Low shelf' },
  { value: 'highshelf', label: 'High shelf' },
  { value: 'highpass', label: 'High-pass (12 dB/oct)' },
  { value: 'lowpass', label: 'Low-pass (12 dB/oct)' },
  { value: 'bandpass', label: 'Band-pass' },
  { value: 'notch', label: 'Notch' },
  { value: 'allpass', label: 'All-pass' },
  { value: 'crossover-high', label: 'Crossover, high side' },
  { value: 'crossover-low', label: 'Crossover, low side' },
] as const;

const FAMILIES = [
  { value: 'linkwitz-riley', label: 'Linkwitz-Riley' },
  { value: 'butterworth', label: 'Butterworth' },
] as const;

interface Props {
  index: number;
  draft: FilterDraft;
  onChange: (draft: FilterDraft) => void;
  onRemove: () => void;
}

/** The fields one filter type needs, nothing more. */
export default function FilterRow({ index, draft, onChange, onRemove }: Props) {
  const kind = kindOf(draft.type);
  const field = (key: keyof FilterDraft) => (value: string) => onChange({ ...draft, [key]: clean(value) });
  const family = draft.family === 'butterworth' ? 'butterworth' : 'linkwitz-riley';
  const slopes = LIMITS.crossoverSlopesDbPerOctave[family].map((s) => ({ value: String(s), label: `${s} dB/oct` }));
  return (
    <li className="rounded-lg border border-line p-3" data-testid={`filter-${index}`}>
      <div className="mb-2 flex items-end gap-2">
        <div className="flex-1">
          <SelectField label={`Filter ${index + 1}`} value={draft.type} options={TYPES} onChange={(type) => onChange(retype(draft, type))} testId={`filter-${index}-type`} />
        </div>
        <button type="button" onClick={onRemove} aria-label={`Remove filter ${index + 1}`} className="h-12 w-12 shrink-0 rounded-lg border border-line text-xl">
          ×
        </button>
      </div>
      <div className="grid grid-cols-2 gap-2 sm:grid-cols-3">
        <NumberField label="Freq" value={draft.freq} onChange={field('freq')} unit="Hz" testId={`filter-${index}-freq`} />
        {(kind === 'bell' || kind === 'shelf') && <NumberField label="Gain" value={draft.gain} onChange={field('gain')} unit="dB" signed testId={`filter-${index}-gain`} />}
        {(kind === 'bell' || kind === 'pass') && <NumberField label="Q" value={draft.q} onChange={field('q')} testId={`filter-${index}-q`} />}
        {kind === 'shelf' && <NumberField label="Slope S" value={draft.slope} onChange={field('slope')} testId={`filter-${index}-slope`} />}
        {kind === 'crossover' && (
          <SelectField label="Slope" value={draft.slope} options={slopes} onChange={field('slope')} testId={`filter-${index}-slope`} />
        )}
        {kind === 'crossover' && (
          <div className="col-span-2 sm:col-span-1">
            <SelectField
              label="Family"
              value={family}
              options={FAMILIES}
              onChange={(next) => {
                const allowed: readonly number[] = LIMITS.crossoverSlopesDbPerOctave[next as 'butterworth' | 'linkwitz-riley'];
                onChange({ ...draft, family: next, slope: allowed.includes(Number(draft.slope)) ? draft.slope : '24' });
              }}
              testId={`filter-${index}-family`}
            />
          </div>
        )}
      </div>
    </li>
  );
}
