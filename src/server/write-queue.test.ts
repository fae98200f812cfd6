import { describe, expect, it } from 'vitest';
import { enqueueWrite } from './write-queue';

describe('enqueueWrite', () => {
  it('runs jobs one at a time, in the order they arrived', async () => {
    const log: string[] = [];
    const job = (name: string, ms: number) =>
      enqueueWrite(async () => {
        log.push(`${name} start`);
        await new Promise((r) => setTimeout(r, ms));
        log.push(`${name} end`);
        return name;
      });
    const results = await Promise.all([job('a', 20), job('b', 1), job('c', 5)]);
    expect(results).toEqual(['a', 'b', 'c']);
    expect(log).toEqual(['a start', 'a end', 'b start', 'b end', 'c start', 'c end']);
  });

  it('a failed job rejects for its caller and never blocks the jobs behind it', async () => {
    const failed = enqueueWrite(async () => {
      throw new Error('disk full');
    });
    const after = enqueueWrite(async () => 'still runs');
    await expect(failed).rejects.toThrow('disk full');
    await expect(after).resolves.toBe('still runs');
  });
});
