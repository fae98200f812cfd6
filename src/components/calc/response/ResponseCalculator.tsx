import { useRef } from 'react';
import { LIMITS, cascadeResponse, logFrequencyGrid, type CascadeResponse } from '~/lib/acoustics';
import { F_MAX, F_MIN } from '~/lib/plot/frequency-axis';
import Panel from '~/components/calc/Panel';
import SelectField from '~/components/calc/SelectField';
import { attempt, num } from '~/components/calc/attempt';
import { SAMPLE_RATES } from '~/components/calc/unit-switch';
import { useQueryState } from '~/components/calc/use-query-state';
import FilterRow from './FilterRow';
import SaveToPage from '~/components/calc/SaveToPage';
import { blocksFromFilters } from '~/lib/doc/blocks/calc-blocks';
import ResponsePlot from './ResponsePlot';
import { DEFAULT_CHAIN, decodeFilters, encodeFilters, toSpec, type FilterDraft } from './filter-draft';

const DEFAULTS = { rate: '48000', f: DEFAULT_CHAIN };
const REMEMBERED = ['rate'] as const;
const GUIDE = '/calc/guide/filter-response';
/** Points on the curve: smooth at phone width, cheap enough to redraw on every keystroke. */
const POINTS = 400;

/** A chain of filters at a sample rate, plotted as you type, computed on this device. */
export default function ResponseCalculator({ search }: { search: string }) {
  const [s, set] = useQueryState(DEFAULTS, search, REMEMBERED);
  const filters = decodeFilters(s.f);
  const lastGood = useRef<CascadeResponse | null>(null);
  const write = (next: FilterDraft[]) => set({ f: encodeFilters(next) });
  const outcome = attempt(() => {
    const rate = num(s.rate, 'the sample rate');
    const grid = logFrequencyGrid(F_MIN, Math.min(F_MAX, rate / 2), POINTS);
    return { rate, response: cascadeResponse(filters.map(toSpec), grid, rate) };
  });
  if (outcome.ok) lastGood.current = outcome.value.response;
  const shown = lastGood.current;
  const rate = outcome.ok ? outcome.value.rate : Number(s.rate) || 48_000;
  return (
    <div className="flex flex-col gap-4" data-testid="response-calculator">
      <Panel title="Response" guide={`${GUIDE}#reading-the-plot`} testId="plot-panel">
        {!outcome.ok && (
          <p role="status" className="rounded-lg bg-warn-soft p-3 text-warn" data-testid="response-problem">
            {outcome.message}
          </p>
        )}
        {shown && <ResponsePlot freqs={shown.freqs} magnitudeDb={shown.magnitudeDb} phaseDeg={shown.phaseDeg} nyquistHz={rate / 2} />}
        <p className="text-xs text-muted">
          Q per the Audio EQ Cookbook: width between the half-gain points of the analog prototype. Near half the sample rate the digital band is narrower than its Q says.
        </p>
        <SaveToPage
          testId="response-save"
          build={() => {
            if (!outcome.ok) return null;
            const nodes = blocksFromFilters(filters.map(toSpec), outcome.value.rate, 'Filters from the response calculator');
            return nodes.length ? { nodes, summary: `${filters.length} filters from the response calculator` } : null;
          }}
        />
      </Panel>
      <Panel title="Filter chain" guide={`${GUIDE}#filter-chain`} testId="chain-panel">
        <SelectField label="Processor sample rate" value={s.rate} options={SAMPLE_RATES} onChange={(r) => set({ rate: r })} testId="response-rate" />
        <ol className="flex flex-col gap-3">
          {filters.map((draft, i) => (
            <FilterRow
              key={i}
              index={i}
              draft={draft}
              onChange={(next) => write(filters.map((f, j) => (j === i ? next : f)))}
              onRemove={() => write(filters.filter((_, j) => j !== i))}
            />
          ))}
        </ol>
        <button
          type="button"
          disabled={filters.length >= LIMITS.maxFilters}
          onClick={() => write([...filters, { type: 'peaking', freq: '1000', gain: '0', q: '1.41', slope: '', family: '' }])}
          className="min-h-12 rounded-lg border border-line px-4 font-semibold disabled:opacity-40"
          data-testid="add-filter"
        >
          Add a filter
        </button>
      </Panel>
    </div>
  );
}
