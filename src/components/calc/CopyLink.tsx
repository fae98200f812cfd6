import { useState } from 'react';

/**
 * Copies the page's address — every input is in it — because the installed app has no address bar
 * to copy from. Falls back to selecting the link in a prompt-free text box when the clipboard API is
 * missing (plain http on a venue's own network).
 */
export default function CopyLink() {
  const [state, setState] = useState<'idle' | 'copied' | 'shown'>('idle');
  const [fallback, setFallback] = useState('');
  const copy = async () => {
    const href = window.location.href;
    try {
      await navigator.clipboard.writeText(href);
      setState('copied');
    } catch {
      setFallback(href);
      setState('shown');
    }
  };
  return (
    <div className="mt-2 flex flex-wrap items-center gap-2">
      <button type="button" onClick={copy} data-testid="copy-link" className="min-h-11 rounded-md border border-line px-3 text-sm font-semibold">
        {state === 'copied' ? 'Link copied' : 'Copy link'}
      </button>
      {state === 'shown' && (
        <input readOnly value={fallback} aria-label="Link to this result" onFocus={(e) => e.currentTarget.select()} autoFocus className="min-w-0 flex-1 rounded-md border border-line bg-surface px-2 text-sm" />
      )}
    </div>
  );
}
