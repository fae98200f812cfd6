import { EQ_BLOCK, newEqBlock } from './block-data';
import { blockNode } from './block-node';

/** An EQ block: a processor output's bands at its sample rate, plus output gain, polarity and a note. */
export const EqBlock = blockNode(EQ_BLOCK, newEqBlock);
