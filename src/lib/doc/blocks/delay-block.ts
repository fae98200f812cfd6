import { DELAY_BLOCK, newDelayBlock } from './block-data';
import { blockNode } from './block-node';

/** A delay block: outputs or zones with their distance or time to the alignment point. */
export const DelayBlock = blockNode(DELAY_BLOCK, newDelayBlock);
