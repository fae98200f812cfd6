import type { Editor } from '@tiptap/react';
import { useId, useState, type FormEvent } from 'react';
import { isSafeLinkHref } from '~/lib/doc/safe-url';

/** Sets, changes or removes the link on the selected text; refuses what the server would refuse. */
export function LinkForm({ editor, onClose }: { editor: Editor; onClose: () => void }) {
  const id = useId();
  const [href, setHref] = useState<string>(() => (editor.getAttributes('link').href as string | undefined) ?? '');
  const [error, setError] = useState('');

  function apply(e: FormEvent) {
    e.preventDefault();
    const value = href.trim();
    const withScheme = /^www\./i.test(value) ? `https://${value}` : value;
    if (!isSafeLinkHref(withScheme)) {
      setError('Use a web address (https://…), an e-mail link (mailto:…) or a path on this site (/venues/…).');
      return;
    }
    const chain = editor.chain().focus().extendMarkRange('link');
    if (editor.state.selection.empty && !editor.isActive('link')) {
      chain.insertContent({ type: 'text', text: withScheme, marks: [{ type: 'link', attrs: { href: withScheme } }] }).run();
    } else {
      chain.setLink({ href: withScheme }).run();
    }
    onClose();
  }

  return (
    <form onSubmit={apply} className="flex flex-wrap items-end gap-2 border-t border-line p-2" data-testid="link-form">
      <div className="min-w-0 flex-1">
        <label htmlFor={id} className="block text-xs font-semibold text-muted">
          Link address
        </label>
        <input
          id={id}
          type="text"
          inputMode="url"
          autoFocus
          value={href}
          onChange={(e) => {
            setHref(e.target.value);
            setError('');
          }}
          placeholder="https://… or /venues/…"
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          className="min-h-11 w-full rounded-md border border-line bg-bg px-3"
        />
        {error && (
          <p id={`${id}-error`} className="mt-1 text-sm text-danger">
            {error}
          </p>
        )}
      </div>
      <button type="submit" className="min-h-11 rounded-md bg-accent px-4 font-semibold text-accent-fg">
        Apply
      </button>
      {editor.isActive('link') && (
        <button
          type="button"
          onClick={() => {
            editor.chain().focus().extendMarkRange('link').unsetLink().run();
            onClose();
          }}
          className="min-h-11 rounded-md border border-line px-4"
        >
          Remove link
        </button>
      )}
      <button type="button" onClick={onClose} className="min-h-11 rounded-md px-4 hover:bg-sunken">
        Cancel
      </button>
    </form>
  );
}
