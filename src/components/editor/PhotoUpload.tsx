import { useEffect, useId, useRef, useState } from 'react';
import type { FileView } from '~/lib/schemas/file';
import { MAX_CAPTION_CHARS, UPLOAD_ACCEPT } from '~/lib/upload-limits';
import { formatBytes } from '~/components/files/format-bytes';
import { ApiError } from '~/components/api/client';
import { uploadFile } from '~/components/api/upload-file';

type Stage = 'empty' | 'ready' | 'sending' | 'processing' | 'done' | 'error';

interface Props {
  venueSlug: string;
  /** The page being edited (absent while creating one); recorded with the file. */
  pageSlug?: string;
  /** Called once the server has stored the file; the caller puts it into the page. */
  onStored: (file: FileView) => void;
  onDone: () => void;
}

const STAGE_WORDS: Record<Stage, string> = {
  empty: '',
  ready: 'Ready to send',
  sending: 'Sending',
  processing: 'Sent; the server is making the display size…',
  done: 'Added to the page',
  error: 'Not sent',
};

/** One photo or PDF from this device: pick it, caption it, watch it go, and it lands at the cursor. */
export function PhotoUpload({ venueSlug, pageSlug, onStored, onDone }: Props) {
  const inputId = useId();
  const captionId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<string | null>(null);
  const [caption, setCaption] = useState('');
  const [stage, setStage] = useState<Stage>('empty');
  const [progress, setProgress] = useState(0);
  const [error, setError] = useState('');
  const controller = useRef<AbortController | null>(null);

  useEffect(() => () => void (preview && URL.revokeObjectURL(preview)), [preview]);
  // Closing the dialog unmounts this: a running upload is cancelled with it.
  useEffect(() => () => controller.current?.abort(), []);

  function choose(list: FileList | null) {
    const picked = list?.[0];
    if (!picked) return;
    setFile(picked);
    // HEIC cannot be previewed by most browsers; the server says whether it can read it.
    setPreview(picked.type.startsWith('image/') && !/heic|heif/i.test(picked.type) ? URL.createObjectURL(picked) : null);
    setStage('ready');
    setProgress(0);
    setError('');
  }

  async function send() {
    if (!file) return;
    const abort = new AbortController();
    controller.current = abort;
    setStage('sending');
    setProgress(0);
    setError('');
    try {
      const { file: stored } = await uploadFile(venueSlug, file, { caption: caption.trim(), page: pageSlug, signal: abort.signal }, (fraction) => {
        setProgress(fraction);
        if (fraction >= 1) setStage('processing');
      });
      setProgress(1);
      setStage('done');
      onStored(stored);
    } catch (err) {
      if (abort.signal.aborted) {
        setStage('ready');
        setProgress(0);
        return;
      }
      setStage('error');
      setError(err instanceof ApiError ? err.error : 'The upload failed; try again.');
    } finally {
      controller.current = null;
    }
  }

  function again() {
    setFile(null);
    setPreview(null);
    setCaption('');
    setStage('empty');
    setProgress(0);
  }

  const busy = stage === 'sending' || stage === 'processing';
  const button = 'min-h-11 rounded-lg px-4 font-semibold';
  return (
    <div className="space-y-3" data-testid="photo-upload" data-status={stage}>
      <div className={stage === 'done' ? 'hidden' : 'flex flex-wrap items-center gap-3'}>
        <input id={inputId} type="file" accept={UPLOAD_ACCEPT} className="peer sr-only" disabled={busy} onChange={(e) => choose(e.currentTarget.files)} data-testid="photo-file-input" />
        <label
          htmlFor={inputId}
          className={`${button} inline-flex cursor-pointer items-center border border-line bg-bg hover:bg-sunken peer-focus-visible:outline-3 peer-focus-visible:outline-focus peer-disabled:cursor-default peer-disabled:opacity-50`}
        >
          {file ? 'Choose a different one' : 'Choose a photo or PDF'}
        </label>
        <span className="text-xs text-muted">From the camera roll or the camera. Up to 25 MiB; location data is removed.</span>
      </div>

      {file && (
        <>
          <div className="flex items-center gap-3">
            <div className="h-16 w-16 shrink-0 overflow-hidden rounded-md bg-sunken" aria-hidden="true">
              {preview ? (
                <img src={preview} alt="" className="h-full w-full object-cover" />
              ) : (
                <span className="flex h-full items-center justify-center text-xs font-semibold text-muted">{/pdf/i.test(file.type) ? 'PDF' : 'FILE'}</span>
              )}
            </div>
            <p className="min-w-0 flex-1">
              <span className="block truncate font-medium" title={file.name}>
                {file.name}
              </span>
              <span className="text-xs text-muted">{formatBytes(file.size)}</span>
            </p>
          </div>
          <div>
            <label htmlFor={captionId} className="block text-sm font-semibold">
              Caption <span className="font-normal text-muted">(optional; also describes the photo for screen readers)</span>
            </label>
            <input
              id={captionId}
              type="text"
              value={caption}
              maxLength={MAX_CAPTION_CHARS}
              disabled={busy || stage === 'done'}
              onChange={(e) => setCaption(e.currentTarget.value)}
              placeholder="e.g. Amp rack B, stage left"
              className="mt-1 min-h-11 w-full rounded-md border border-line bg-bg px-3"
              data-testid="photo-caption"
            />
          </div>
          <div className="flex items-center gap-3">
            <progress max={1} value={progress} aria-label="Upload progress" className="h-2 min-w-0 flex-1 accent-[var(--tl-accent)]" data-testid="photo-progress" />
            <span className="shrink-0 text-xs text-muted" aria-live="polite" data-testid="photo-stage">
              {stage === 'sending' ? `${STAGE_WORDS.sending} ${Math.round(progress * 100)}%` : STAGE_WORDS[stage]}
            </span>
          </div>
          {error && (
            <p role="alert" className="text-sm text-danger" data-testid="photo-error">
              {error}
            </p>
          )}
          <div className="flex flex-wrap gap-2">
            {(stage === 'ready' || stage === 'error') && (
              <button type="button" onClick={send} className={`${button} bg-accent text-accent-fg`} data-testid="photo-send">
                {stage === 'error' ? 'Try again' : 'Upload and add to the page'}
              </button>
            )}
            {busy && (
              <button type="button" onClick={() => controller.current?.abort()} className={`${button} border border-line`} data-testid="photo-cancel-upload">
                Stop the upload
              </button>
            )}
            {stage === 'done' && (
              <>
                <button type="button" onClick={onDone} className={`${button} bg-accent text-accent-fg`} autoFocus data-testid="photo-done">
                  Back to the page
                </button>
                <button type="button" onClick={again} className={`${button} border border-line`}>
                  Add another
                </button>
              </>
            )}
          </div>
        </>
      )}
    </div>
  );
}
