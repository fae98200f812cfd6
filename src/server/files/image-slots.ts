/**
 * At most two photos are decoded at once: a 24-MP photo takes a few hundred MB while it is
 * re-encoded, and the server shares two cores with everything else. Later uploads wait here.
 */
const MAX_CONCURRENT = 2;
let running = 0;
const waiting: (() => void)[] = [];

export async function withImageSlot<T>(work: () => Promise<T>): Promise<T> {
  if (running >= MAX_CONCURRENT) await new Promise<void>((resolve) => waiting.push(resolve));
  else running++;
  try {
    return await work();
  } finally {
    const next = waiting.shift();
    if (next) next();
    else running--;
  }
}
