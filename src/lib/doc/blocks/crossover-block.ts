import { CROSSOVER_BLOCK, newCrossoverBlock } from './block-data';
import { blockNode } from './block-node';

/** A crossover block: two to four ways, each with its edges, gain, polarity and delay. */
export const CrossoverBlock = blockNode(CROSSOVER_BLOCK, newCrossoverBlock);
