import type { AnyExtension } from '@tiptap/core';
import { Image } from '@tiptap/extension-image';
import { TaskItem, TaskList } from '@tiptap/extension-list';
import { TableKit } from '@tiptap/extension-table';
import { StarterKit } from '@tiptap/starter-kit';
import { CrossoverBlock } from './blocks/crossover-block';
import { DelayBlock } from './blocks/delay-block';
import { EqBlock } from './blocks/eq-block';
import { isSafeLinkHref } from './safe-url';

/**
 * The ONE list of document extensions. The editor island builds its editor from it and the server
 * builds the schema every save is checked against from it, so the two can never disagree about
 * what a page may contain. A new block (an EQ, crossover or delay node) is one more entry here,
 * plus its attribute rules in attr-rules.ts and a renderer passed to renderDocHtml; the editor may
 * `.extend()` the same node with a React node view without touching the schema.
 */
export const HEADING_LEVELS = [1, 2, 3, 4] as const;

export const docExtensions: AnyExtension[] = [
  StarterKit.configure({
    heading: { levels: [...HEADING_LEVELS] },
    link: {
      openOnClick: false,
      autolink: true,
      defaultProtocol: 'https',
      isAllowedUri: (url) => isSafeLinkHref(url),
    },
  }),
  // A wrapper that scrolls sideways keeps wide patch lists usable on a phone.
  TableKit.configure({ table: { resizable: false, renderWrapper: true } }),
  TaskList,
  TaskItem.configure({ nested: true }),
  Image.configure({ inline: false, allowBase64: false }),
  EqBlock,
  CrossoverBlock,
  DelayBlock,
];
