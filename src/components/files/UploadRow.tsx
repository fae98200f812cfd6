import { useId } from 'react';
import type { FileView } from '~/lib/schemas/file';
import { formatBytes } from './format-bytes';
import { MAX_CAPTION_CHARS } from '~/lib/upload-limits';

export interface QueuedUpload {
  key: number;
  file: File;
  caption: string;
  /** `refused`: the browser already knows the server would refuse it; it is never sent. */
  status: 'ready' | 'sending' | 'processing' | 'done' | 'error' | 'refused';
  /** Fraction of the bytes sent, from the browser's upload progress events. */
  progress: number;
  preview: string | null;
  error?: string;
  result?: FileView;
}

const STATUS_WORDS: Record<QueuedUpload['status'], string> = {
  ready: 'Ready',
  sending: 'Sending',
  processing: 'Sent; making the thumbnail…',
  done: 'Saved',
  error: 'Not saved',
  refused: 'Will not be sent',
};

interface Props {
  item: QueuedUpload;
  busy: boolean;
  onCaption: (caption: string) => void;
  onRemove: () => void;
}

export function UploadRow({ item, busy, onCaption, onRemove }: Props) {
  const captionId = useId();
  const percent = Math.round(item.progress * 100);
  const editable = item.status === 'ready' || item.status === 'error';
  const failed = item.status === 'error' || item.status === 'refused';
  return (
    <li className="space-y-2 rounded-lg border border-line bg-surface p-3" data-testid="upload-row" data-status={item.status}>
      <div className="flex items-center gap-3">
        <div className="h-14 w-14 shrink-0 overflow-hidden rounded-md bg-sunken" aria-hidden="true">
          {item.preview ? (
            <img src={item.preview} alt="" className="h-full w-full object-cover" />
          ) : (
            <span className="flex h-full items-center justify-center text-xs font-semibold text-muted">{/pdf/i.test(item.file.type) ? 'PDF' : 'FILE'}</span>
          )}
        </div>
        <div className="min-w-0 flex-1">
          <p className="truncate font-medium" title={item.file.name}>
            {item.file.name}
          </p>
          <p className="text-xs text-muted">{formatBytes(item.file.size)}</p>
        </div>
        {(editable || item.status === 'refused') && !busy && (
          <button type="button" onClick={onRemove} className="min-h-11 min-w-11 rounded-md px-2 text-muted hover:bg-sunken" aria-label={`Remove ${item.file.name} from the list`}>
            ✕
          </button>
        )}
      </div>
      <label htmlFor={captionId} className="sr-only">
        Caption for {item.file.name}
      </label>
      <input
        id={captionId}
        type="text"
        value={item.caption}
        maxLength={MAX_CAPTION_CHARS}
        placeholder="Caption, e.g. “Amp rack, stage left”"
        disabled={!editable || busy}
        onChange={(e) => onCaption(e.currentTarget.value)}
        className="min-h-11 w-full rounded-md border border-line bg-bg px-3"
        data-testid="upload-caption"
      />
      <div className="flex items-center gap-3">
        {failed ? (
          // A full bar beside "Not saved" would say the opposite of the words.
          <span className="h-2 min-w-0 flex-1 rounded-full bg-danger/20" aria-hidden="true" />
        ) : (
          <progress
            max={1}
            value={item.progress}
            className="h-2 min-w-0 flex-1 accent-[var(--tl-accent)]"
            aria-label={`Upload progress for ${item.file.name}`}
            data-testid="upload-progress"
          />
        )}
        <span className={`shrink-0 text-right text-xs ${failed ? 'font-semibold text-danger' : 'text-muted'}`} aria-live="polite">
          {item.status === 'sending' ? `${STATUS_WORDS.sending} ${percent}%` : STATUS_WORDS[item.status]}
        </span>
      </div>
      {item.error && (
        <p className="text-sm text-danger" role="alert">
          {item.error}
        </p>
      )}
    </li>
  );
}
