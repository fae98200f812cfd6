import { EXPOSURE_CAUTION, LIMITS, euDailyExposure, usDose } from '~/lib/acoustics';
import CopyLink from '~/components/calc/CopyLink';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed } from '~/components/calc/format';
import { GUIDE, type DosePanelProps } from './dose-state';

const MAX_ROWS = Math.min(12, LIMITS.maxSegments);
const ACTION = { none: 'below the action values', lower: 'lower action value (80) reached', upper: 'upper action value (85) reached', limit: 'exposure limit value (87) reached' } as const;

/** Segments of level and time → dose and TWA (OSHA, NIOSH) and LEX,8h (EU). */
export default function DosePanel({ s, set }: DosePanelProps) {
  const rows = s.seg.split(',').slice(0, MAX_ROWS).map((pair) => {
    const [level = '', hours = ''] = pair.split(':');
    return { level, hours };
  });
  const write = (next: { level: string; hours: string }[]) => set({ seg: next.map((r) => `${r.level.replace(',', '.')}:${r.hours.replace(',', '.')}`).join(',') });
  const segments = () => rows.map((r, i) => ({ levelDba: num(r.level, `the level in row ${i + 1}`), hours: num(r.hours, `the hours in row ${i + 1}`) }));
  const osha = attempt(() => usDose(segments(), 'osha'));
  const niosh = attempt(() => usDose(segments(), 'niosh'));
  const eu = attempt(() => euDailyExposure(segments()));
  return (
    <Panel title="Show dose" guide={`${GUIDE}#show-dose`} testId="dose-panel">
      <ol className="flex flex-col gap-2">
        {rows.map((r, i) => (
          <li key={i} className="flex items-end gap-2">
            <div className="min-w-0 flex-1">
              <NumberField label={`Level ${i + 1}`} value={r.level} onChange={(level) => write(rows.map((x, j) => (j === i ? { ...x, level } : x)))} unit="dBA" testId={`dose-level-${i}`} />
            </div>
            <div className="w-28">
              <NumberField label="For" value={r.hours} onChange={(hours) => write(rows.map((x, j) => (j === i ? { ...x, hours } : x)))} unit="h" testId={`dose-hours-${i}`} />
            </div>
            <button type="button" aria-label={`Remove row ${i + 1}`} disabled={rows.length <= 1} onClick={() => write(rows.filter((_, j) => j !== i))} className="h-12 w-11 shrink-0 rounded-lg border border-line text-xl disabled:opacity-40">
              −
            </button>
          </li>
        ))}
      </ol>
      <button type="button" disabled={rows.length >= MAX_ROWS} onClick={() => write([...rows, { level: '85', hours: '1' }])} className="min-h-12 rounded-lg border border-line px-4 font-semibold disabled:opacity-40" data-testid="dose-add">
        Add a segment
      </button>
      <div className="grid gap-3 sm:grid-cols-3">
        <div className="rounded-lg border border-line p-3" data-testid="dose-osha">
          <div className="font-bold">OSHA</div>
          <Result outcome={osha} share={false}>
            {(d) => (
              <div data-testid="dose-osha-value">
                <div className="text-2xl font-bold tabular-nums">{fixed(d.dosePercent, 1)} %</div>
                <div className="text-sm text-muted">TWA {d.twa === null ? '—' : `${fixed(d.twa, 1)} dBA`}</div>
                {d.notPermitted && <div className="text-sm text-warn">A segment above 115 dBA: not permitted at all.</div>}
              </div>
            )}
          </Result>
        </div>
        <div className="rounded-lg border border-line p-3" data-testid="dose-niosh">
          <div className="font-bold">NIOSH</div>
          <Result outcome={niosh} share={false}>
            {(d) => (
              <div data-testid="dose-niosh-value">
                <div className="text-2xl font-bold tabular-nums">{fixed(d.dosePercent, 1)} %</div>
                <div className="text-sm text-muted">TWA {d.twa === null ? '—' : `${fixed(d.twa, 1)} dBA`}</div>
              </div>
            )}
          </Result>
        </div>
        <div className="rounded-lg border border-line p-3" data-testid="dose-eu">
          <div className="font-bold">EU 2003/10/EC</div>
          <Result outcome={eu} share={false}>
            {(d) => (
              <div data-testid="dose-eu-value">
                <div className="text-2xl font-bold tabular-nums">{fixed(d.lex8h, 1)} dB(A)</div>
                <div className={`text-sm ${d.actionLevel === 'none' ? 'text-muted' : 'text-warn'}`}>LEX,8h: {ACTION[d.actionLevel]}</div>
              </div>
            )}
          </Result>
        </div>
      </div>
      <CopyLink />
      <p className="rounded-lg bg-warn-soft p-3 text-sm text-fg" data-testid="dose-caution">
        <strong className="text-warn">Hearing caution. </strong>
        {EXPOSURE_CAUTION}
      </p>
    </Panel>
  );
}
