/**
 * The processor blocks of a document in reading order, numbered from 1: the same order the read
 * view renders them in, so "block 2" in a download link is the second plot on the page.
 */
import type { PmNode } from '~/lib/doc/types';
import { PROCESSOR_BLOCKS } from './block-data';

export function processorBlocksInOrder(doc: PmNode): PmNode[] {
  const out: PmNode[] = [];
  const stack: PmNode[] = [doc];
  while (stack.length) {
    const node = stack.pop()!;
    if ((PROCESSOR_BLOCKS as readonly string[]).includes(node.type)) out.push(node);
    if (node.content) for (let i = node.content.length - 1; i >= 0; i--) stack.push(node.content[i]);
  }
  return out;
}
