import type { AnyExtension } from '@tiptap/core';
import { ReactNodeViewRenderer } from '@tiptap/react';
import { docExtensions } from '~/lib/doc/extensions';
import { CROSSOVER_BLOCK, DELAY_BLOCK, EQ_BLOCK } from '~/lib/doc/blocks/block-data';
import CrossoverBlockView from './CrossoverBlockView';
import DelayBlockView from './DelayBlockView';
import EqBlockView from './EqBlockView';

const VIEWS = { [EQ_BLOCK]: EqBlockView, [CROSSOVER_BLOCK]: CrossoverBlockView, [DELAY_BLOCK]: DelayBlockView };

/** The shared extension list with the processor blocks' React node views attached; the schema is unchanged. */
export const editorExtensions: AnyExtension[] = docExtensions.map((ext) => {
  const view = VIEWS[ext.name as keyof typeof VIEWS];
  return view ? ext.extend({ addNodeView: () => ReactNodeViewRenderer(view) }) : ext;
});
