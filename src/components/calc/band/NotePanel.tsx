import { frequencyFromNote, noteFromFrequency } from '~/lib/acoustics';
import Choice from '~/components/calc/Choice';
import NumberField from '~/components/calc/NumberField';
import Panel from '~/components/calc/Panel';
import Result, { Figure } from '~/components/calc/Result';
import { attempt, num } from '~/components/calc/attempt';
import { fixed, sig } from '~/components/calc/format';
import { GUIDE, type BandPanelProps } from './band-state';

/** Nearest equal-tempered note of a frequency (with cents), or the frequency of a note. */
export default function NotePanel({ s, set }: BandPanelProps) {
  const fromFreq = s.ndir !== 'note';
  const outcome = attempt(() => {
    const a4 = num(s.a4, 'the reference pitch A4');
    const freq = fromFreq ? num(s.nfreq, 'the frequency') : frequencyFromNote(s.note, a4);
    return { ...noteFromFrequency(freq, a4), input: freq };
  });
  return (
    <Panel title="Note finder" guide={`${GUIDE}#note-finder`} testId="note-panel">
      <Choice label="Find" value={fromFreq ? 'freq' : 'note'} onChange={(ndir) => set({ ndir })} options={[{ value: 'freq', label: 'Note of a frequency' }, { value: 'note', label: 'Frequency of a note' }]} testId="note-dir" />
      <div className="grid grid-cols-2 gap-3">
        {fromFreq ? (
          <NumberField label="Frequency" value={s.nfreq} onChange={(nfreq) => set({ nfreq })} unit="Hz" testId="note-freq" />
        ) : (
          <div className="flex min-w-0 flex-col gap-1">
            <label htmlFor="note-name" className="text-sm font-medium text-muted">
              Note (e.g. A4, C#3, Eb2)
            </label>
            <input
              id="note-name"
              data-testid="note-name"
              value={s.note}
              autoCapitalize="characters"
              autoComplete="off"
              spellCheck={false}
              onChange={(event) => set({ note: event.target.value })}
              className="h-12 w-full rounded-lg border border-line bg-sunken px-3 text-lg text-fg"
            />
          </div>
        )}
        <NumberField label="A4 tuned to" value={s.a4} onChange={(a4) => set({ a4 })} unit="Hz" testId="note-a4" />
      </div>
      <Result outcome={outcome} testId="note-result">
        {({ note, freq, cents }) => (
          <div className="flex flex-wrap gap-x-6 gap-y-2">
            <Figure label="Note" value={note} big testId="note-result-name" />
            <Figure label="Note frequency" value={sig(freq, 6)} unit="Hz" testId="note-result-freq" />
            {fromFreq && <Figure label="Offset" value={`${cents >= 0 ? '+' : ''}${fixed(cents, 1)}`} unit="cents" testId="note-result-cents" />}
          </div>
        )}
      </Result>
    </Panel>
  );
}
