import { Node } from '@tiptap/core';

/**
 * A processor block as a Tiptap node: an atom (edited only through its node view), one attribute
 * per field with a default, and an HTML form (data attributes holding JSON) so copy and paste
 * between pages keeps the values. The server checks the attributes itself (attr-rules.ts).
 */
export function blockNode<T extends object>(name: string, defaults: () => T) {
  return Node.create({
    name,
    group: 'block',
    atom: true,
    selectable: true,
    draggable: true,
    addAttributes() {
      const initial = defaults() as Record<string, unknown>;
      return Object.fromEntries(
        Object.entries(initial).map(([key, value]) => [
          key,
          {
            default: value,
            parseHTML: (element: HTMLElement) => {
              const raw = element.getAttribute(`data-${key.toLowerCase()}`);
              if (raw === null) return value;
              try {
                return JSON.parse(raw);
              } catch {
                return value;
              }
            },
            renderHTML: (attrs: Record<string, unknown>) => ({ [`data-${key.toLowerCase()}`]: JSON.stringify(attrs[key]) }),
          },
        ]),
      );
    },
    parseHTML() {
      return [{ tag: `div[data-block="${name}"]` }];
    },
    renderHTML({ HTMLAttributes }) {
      return ['div', { ...HTMLAttributes, 'data-block': name }];
    },
  });
}
