/**
 * All writes in this process go through one queue. The libSQL client fails at once on
 * SQLITE_BUSY inside the process, so two overlapping write transactions would turn into a 500;
 * queued, they simply wait their turn. A failed job never blocks the ones behind it.
 */
let tail: Promise<unknown> = Promise.resolve();

export function enqueueWrite<T>(work: () => Promise<T>): Promise<T> {
  const run = tail.then(work, work);
  tail = run.catch(() => undefined);
  return run;
}
