import { useEffect, useRef, useState } from 'react';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import { attempt, num } from '~/components/calc/attempt';
import { useQueryState } from '~/components/calc/use-query-state';
import { LEVEL_MAX_DBFS, LEVEL_MIN_DBFS, SignalPlayer, START_LEVEL_DBFS, type SignalKind } from './signal-player';

const GUIDE = '/calc/guide/test-signal';
const KINDS = [
  { value: 'pink', label: 'Pink' },
  { value: 'white', label: 'White' },
  { value: 'sine', label: 'Sine' },
] as const;
/** Sine limits: low enough for subs, below Nyquist at 44.1 kHz. */
const SINE_MIN_HZ = 10;
const SINE_MAX_HZ = 20_000;

/**
 * Test-signal player. The level from a link is kept in the link but never applied louder than
 * START_LEVEL_DBFS on arrival: a shared link must not start a PA loud.
 */
export default function SignalGenerator({ search }: { search: string }) {
  const [s, set] = useQueryState({ sig: 'pink', freq: '1000', level: String(START_LEVEL_DBFS) }, search);
  const [playing, setPlaying] = useState(false);
  const [problem, setProblem] = useState('');
  const player = useRef<SignalPlayer | null>(null);
  const level = Math.min(LEVEL_MAX_DBFS, Math.max(LEVEL_MIN_DBFS, Math.round(Number(s.level)) || START_LEVEL_DBFS));
  const kind = (KINDS.some((k) => k.value === s.sig) ? s.sig : 'pink') as SignalKind;
  const sine = attempt(() => {
    const f = num(s.freq, 'the sine frequency');
    if (f < SINE_MIN_HZ || f > SINE_MAX_HZ) throw new RangeError(`The sine frequency must be from ${SINE_MIN_HZ} to ${SINE_MAX_HZ} Hz.`);
    return f;
  });

  useEffect(() => {
    const linked = Number(new URLSearchParams(window.location.search).get('level') ?? s.level);
    if (!(linked <= START_LEVEL_DBFS)) set({ level: String(START_LEVEL_DBFS) });
    return () => void player.current?.close();
    // Only on arrival; see the comment above the component.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  useEffect(() => player.current?.setLevel(level), [level]);
  const sineHz = sine.ok ? sine.value : null;
  useEffect(() => {
    if (sineHz !== null) player.current?.setFrequency(sineHz);
  }, [sineHz]);

  const start = async (which: SignalKind) => {
    setProblem('');
    if (which === 'sine' && !sine.ok) return setProblem(sine.message);
    try {
      player.current ??= new SignalPlayer();
      await player.current.start(which, sine.ok ? sine.value : 1000, level);
      setPlaying(true);
    } catch {
      setProblem('This browser could not start audio output. Check that the device is not muted and try again.');
    }
  };
  const stop = () => {
    player.current?.stop();
    setPlaying(false);
  };
  const nudge = (db: number) => set({ level: String(Math.min(LEVEL_MAX_DBFS, Math.max(LEVEL_MIN_DBFS, level + db))) });

  return (
    <Panel title="Signal" guide={`${GUIDE}#signals`} testId="signal-panel">
      <p className="rounded-lg bg-warn-soft p-3 text-sm" role="note" data-testid="signal-caution">
        <strong className="text-warn">Hearing caution. </strong>
        Turn the system down before you start and bring it up slowly. Noise through a PA can reach harmful levels in seconds; protect your ears and everyone in the room.
      </p>
      <Choice label="Signal" value={kind} onChange={(sig) => { set({ sig }); if (playing) void start(sig as SignalKind); }} options={KINDS} testId="signal-kind" />
      {kind === 'sine' && <NumberField label="Sine frequency" value={s.freq} onChange={(freq) => set({ freq })} unit="Hz" testId="signal-freq" />}
      <div className="flex flex-col gap-1">
        <label htmlFor="signal-level" className="text-sm font-medium text-muted">
          Level: <span className="font-semibold text-fg tabular-nums" data-testid="signal-level-value">{level} dBFS</span>
        </label>
        <div className="flex items-center gap-2">
          <button type="button" onClick={() => nudge(-3)} className="h-12 w-14 rounded-lg border border-line font-semibold" aria-label="3 dB quieter">−3</button>
          <input id="signal-level" type="range" min={LEVEL_MIN_DBFS} max={LEVEL_MAX_DBFS} step={1} value={level} onChange={(e) => set({ level: e.target.value })} className="h-12 flex-1 accent-[var(--tl-accent)]" />
          <button type="button" onClick={() => nudge(3)} className="h-12 w-14 rounded-lg border border-line font-semibold" aria-label="3 dB louder">+3</button>
        </div>
      </div>
      {problem && <p role="status" className="text-warn">{problem}</p>}
      {playing ? (
        <button type="button" onClick={stop} className="min-h-16 rounded-xl bg-danger text-xl font-bold text-white" data-testid="signal-stop">
          Stop
        </button>
      ) : (
        <button type="button" onClick={() => void start(kind)} className="min-h-16 rounded-xl bg-accent text-xl font-bold text-accent-fg" data-testid="signal-start">
          Start {kind === 'sine' ? 'sine' : `${kind} noise`}
        </button>
      )}
      <p className="text-sm text-muted" role="status" data-testid="signal-status">
        {playing ? `Playing ${kind === 'sine' ? `a ${sine.ok ? sine.value : ''} Hz sine` : `${kind} noise`} at ${level} dBFS.` : 'Stopped.'}
      </p>
    </Panel>
  );
}
