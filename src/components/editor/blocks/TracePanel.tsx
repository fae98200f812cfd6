import { useId, useRef, useState } from 'react';
import useSWR from 'swr';
import { ApiError, fetcher } from '~/components/api/client';
import { addToFiles, filesKey, type FilesAnswer } from '~/components/api/files';
import { uploadFile } from '~/components/api/upload-file';
import { BLOCK_LIMITS, blockTraces, newTraceRef, TRACE_SMOOTHINGS, type TraceCompare, type TraceRef, type TraceSmoothing } from '~/lib/doc/blocks/block-data';
import { field, smallButton } from './BlockFrame';
import { useBlockVenue } from './block-venue';
import { NumberCell, rangeCheck } from './NumberCell';

interface Props {
  traces: TraceRef[] | undefined;
  compare: TraceCompare | null | undefined;
  onChange: (patch: { traces: TraceRef[]; compare: TraceCompare | null }) => void;
  testId: string;
}

const SMOOTHING_WORDS: Record<TraceSmoothing, string> = { 0: 'None (as measured)', 3: '1/3 octave', 6: '1/6 octave', 12: '1/12 octave' };
const TRACE_ACCEPT = 'text/plain,text/csv,.txt,.csv,.tsv';

const traceName = (t: TraceRef, i: number) => t.label || `Trace ${i + 1}`;

/**
 * The measurements a block carries: attach a trace file (new from this device, or one the venue
 * already holds), describe it, line it up, and pick two to compare. The read view draws them.
 */
export function TracePanel({ traces, compare, onChange, testId }: Props) {
  const venue = useBlockVenue();
  const list = blockTraces({ traces });
  const full = list.length >= BLOCK_LIMITS.maxTraces;
  const uploadId = useId();
  const pickId = useId();
  const beforeId = useId();
  const afterId = useId();
  const input = useRef<HTMLInputElement>(null);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState('');
  const { data, error, mutate } = useSWR<FilesAnswer, ApiError>(venue ? filesKey(venue.venueSlug) : null, fetcher, { revalidateOnFocus: false });
  const stored = (data?.files ?? []).filter((f) => f.kind === 'trace' && !f.missing && !list.some((t) => t.fileId === f.id));

  // A comparison naming a trace that is no longer attached is dropped with it.
  const keep = (next: TraceRef[], c: TraceCompare | null | undefined): TraceCompare | null =>
    c && next.some((t) => t.fileId === c.before) && next.some((t) => t.fileId === c.after) ? c : null;
  const setTraces = (next: TraceRef[], c: TraceCompare | null | undefined = compare) => onChange({ traces: next, compare: keep(next, c) });
  const setTrace = (i: number, patch: Partial<TraceRef>) => setTraces(list.map((t, j) => (j === i ? { ...t, ...patch } : t)));
  const attach = (fileId: string, label: string) => {
    if (list.some((t) => t.fileId === fileId) || full) return;
    setTraces([...list, newTraceRef(fileId, label.slice(0, BLOCK_LIMITS.traceTextChars))]);
  };

  async function upload(files: FileList | null) {
    const file = files?.[0];
    if (!file || !venue) return;
    setBusy(true);
    setMessage(`Sending ${file.name}…`);
    try {
      const answer = await uploadFile(venue.venueSlug, file, { page: venue.pageSlug });
      if (answer.file.kind !== 'trace') {
        setMessage(`${file.name} was stored, but it is not a measurement trace; it was not attached.`);
      } else {
        await addToFiles(mutate, answer.file);
        attach(answer.file.id, file.name.replace(/\.[^.]+$/, ''));
        setMessage(`${file.name} attached. Give it a label below.`);
      }
    } catch (err) {
      setMessage(err instanceof ApiError ? err.error : 'The trace was not sent; try again.');
    } finally {
      setBusy(false);
      if (input.current) input.current.value = '';
    }
  }

  // A half-chosen pair lives here until both ends are picked; the block only ever holds a whole one.
  const [pending, setPending] = useState({ before: '', after: '' });
  const pairBefore = compare?.before ?? pending.before;
  const pairAfter = compare?.after ?? pending.after;
  const setPair = (before: string, after: string) => {
    setPending({ before, after });
    setTraces(list, before && after && before !== after ? { before, after } : null);
  };

  // Both ends of the comparison choose from the same list.
  const compareOptions = (
    <>
      <option value="">No comparison</option>
      {list.map((t, i) => (
        <option key={t.fileId} value={t.fileId}>
          {traceName(t, i)}
        </option>
      ))}
    </>
  );
  return (
    <fieldset className="mt-3 rounded-md border border-line p-2" data-testid={`${testId}-traces`}>
      <legend className="px-1 text-sm font-semibold">Measured traces</legend>
      {list.length === 0 && <p className="text-sm text-muted">No measurements attached. The read view draws attached traces over the curve above.</p>}
      <ol className="flex flex-col gap-2">
        {list.map((t, i) => {
          const file = data?.files.find((f) => f.id === t.fileId);
          return (
            <li key={t.fileId} className="rounded-md border border-line p-2" data-testid={`${testId}-trace-${i}`}>
              <p className="mb-1 text-xs text-muted">{file ? file.originalName : 'Trace file'}</p>
              <div className="flex flex-wrap items-end gap-2">
                <label className="flex min-w-40 flex-1 flex-col text-xs font-semibold">
                  Label
                  <input className={field} value={t.label} maxLength={BLOCK_LIMITS.traceTextChars} placeholder="e.g. before retune" onChange={(e) => setTrace(i, { label: e.target.value })} data-testid={`${testId}-trace-${i}-label`} />
                </label>
                <label className="flex flex-col text-xs font-semibold">
                  Measured on
                  <input type="date" className={field} value={t.date} onChange={(e) => setTrace(i, { date: e.target.value })} data-testid={`${testId}-trace-${i}-date`} />
                </label>
                <label className="flex min-w-40 flex-1 flex-col text-xs font-semibold">
                  Microphone position
                  <input className={field} value={t.position} maxLength={BLOCK_LIMITS.traceTextChars} placeholder="e.g. mix position" onChange={(e) => setTrace(i, { position: e.target.value })} data-testid={`${testId}-trace-${i}-position`} />
                </label>
                <div className="w-28">
                  <NumberCell
                    label="Level offset"
                    unit="dB"
                    value={t.offsetDb}
                    check={rangeCheck('The level offset', BLOCK_LIMITS.traceOffsetDb.min, BLOCK_LIMITS.traceOffsetDb.max, 'dB')}
                    onCommit={(offsetDb) => setTrace(i, { offsetDb })}
                    testId={`${testId}-trace-${i}-offset`}
                  />
                </div>
                <label className="flex flex-col text-xs font-semibold">
                  Smoothing
                  <select className={field} value={t.smoothing} onChange={(e) => setTrace(i, { smoothing: Number(e.target.value) as TraceSmoothing })} data-testid={`${testId}-trace-${i}-smoothing`}>
                    {TRACE_SMOOTHINGS.map((s) => (
                      <option key={s} value={s}>
                        {SMOOTHING_WORDS[s]}
                      </option>
                    ))}
                  </select>
                </label>
                <button type="button" className={`${smallButton} ml-auto`} onClick={() => setTraces(list.filter((_, j) => j !== i))} aria-label={`Detach ${traceName(t, i)} from this block`}>
                  Detach
                </button>
              </div>
            </li>
          );
        })}
      </ol>
      {venue ? (
        <div className="mt-2 flex flex-wrap items-end gap-2">
          {venue.mayUpload && (
            <div className="flex flex-col text-xs font-semibold">
              <label htmlFor={uploadId}>Attach a new trace file (text columns: Hz, dB…)</label>
              <input
                id={uploadId}
                ref={input}
                type="file"
                accept={TRACE_ACCEPT}
                disabled={busy || full}
                onChange={(e) => void upload(e.target.files)}
                className="min-h-11 py-2 text-sm font-normal"
                data-testid={`${testId}-trace-upload`}
              />
            </div>
          )}
          <label className="flex flex-col text-xs font-semibold" htmlFor={pickId}>
            Or attach one the venue already has
            <select
              id={pickId}
              className={field}
              value=""
              disabled={full || stored.length === 0}
              onChange={(e) => {
                const file = stored.find((f) => f.id === e.target.value);
                if (file) attach(file.id, file.caption || file.originalName.replace(/\.[^.]+$/, ''));
              }}
              data-testid={`${testId}-trace-pick`}
            >
              <option value="">{error ? 'The list could not be loaded' : !data ? 'Loading…' : stored.length ? 'Choose a trace file' : 'No other trace files'}</option>
              {stored.map((f) => (
                <option key={f.id} value={f.id}>
                  {f.caption || f.originalName}
                </option>
              ))}
            </select>
          </label>
        </div>
      ) : null}
      {full && <p className="mt-1 text-xs text-muted">A block holds at most {BLOCK_LIMITS.maxTraces} traces; detach one to attach another.</p>}
      <p role="status" aria-live="polite" className="mt-1 text-sm" data-testid={`${testId}-trace-status`}>
        {message}
      </p>
      {list.length >= 2 && (
        <fieldset className="mt-2 flex flex-wrap items-end gap-2 rounded-md border border-line p-2">
          <legend className="px-1 text-xs font-semibold">Compare two traces (draws after − before)</legend>
          <label className="flex flex-col text-xs font-semibold" htmlFor={beforeId}>
            Before
            <select id={beforeId} className={field} value={pairBefore} onChange={(e) => setPair(e.target.value, pairAfter)} data-testid={`${testId}-compare-before`}>
              {compareOptions}
            </select>
          </label>
          <label className="flex flex-col text-xs font-semibold" htmlFor={afterId}>
            After
            <select id={afterId} className={field} value={pairAfter} onChange={(e) => setPair(pairBefore, e.target.value)} data-testid={`${testId}-compare-after`}>
              {compareOptions}
            </select>
          </label>
          {pairBefore && pairAfter && pairBefore === pairAfter && <p className="text-xs text-danger">Pick two different traces.</p>}
        </fieldset>
      )}
    </fieldset>
  );
}
