import type { ReactNode } from 'react';
import { NodeViewWrapper } from '@tiptap/react';
import { BLOCK_LIMITS } from '~/lib/doc/blocks/block-data';

interface Props {
  kind: string;
  label: string;
  onLabel: (label: string) => void;
  sampleRate: number;
  onSampleRate: (rate: number) => void;
  note: string;
  onNote: (note: string) => void;
  onRemove: () => void;
  children: ReactNode;
  testId: string;
}

export const field = 'min-h-11 rounded-md border border-line bg-surface px-2 text-base';
export const smallButton = 'min-h-11 min-w-11 rounded-md border border-line px-2 text-sm font-semibold disabled:opacity-40';

/** What every processor block has in the editor: its description, sample rate, note and a remove button. */
export function BlockFrame({ kind, label, onLabel, sampleRate, onSampleRate, note, onNote, onRemove, children, testId }: Props) {
  return (
    <NodeViewWrapper className="tl-block not-prose" data-testid={testId} contentEditable={false}>
      <div className="flex flex-wrap items-end gap-2">
        <label className="flex min-w-0 flex-1 flex-col text-xs font-semibold">
          {kind}: what it is
          <input className={field} value={label} maxLength={BLOCK_LIMITS.labelChars} onChange={(e) => onLabel(e.target.value)} data-testid={`${testId}-label`} />
        </label>
        <label className="flex flex-col text-xs font-semibold">
          Sample rate
          <select className={field} value={sampleRate} onChange={(e) => onSampleRate(Number(e.target.value))} data-testid={`${testId}-rate`}>
            {BLOCK_LIMITS.sampleRates.map((r) => (
              <option key={r} value={r}>
                {r / 1000} kHz
              </option>
            ))}
          </select>
        </label>
        <button type="button" className={smallButton} onClick={onRemove} aria-label={`Remove this ${kind} block`}>
          Remove
        </button>
      </div>
      {children}
      <label className="mt-2 flex flex-col text-xs font-semibold">
        Note
        <textarea className={`${field} min-h-16 py-1`} value={note} maxLength={BLOCK_LIMITS.noteChars} onChange={(e) => onNote(e.target.value)} />
      </label>
    </NodeViewWrapper>
  );
}
