import { describe, expect, it } from 'vitest';
import { ApiError, apiErrorFrom } from './client';

describe('apiErrorFrom', () => {
  it('keeps the server’s sentence, field and the rest of the body', () => {
    const err = apiErrorFrom(409, { error: 'Someone else saved first.', field: 'doc', current: { number: 4 } });
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toBeInstanceOf(Error);
    expect([err.status, err.error, err.message, err.field]).toEqual([409, 'Someone else saved first.', 'Someone else saved first.', 'doc']);
    expect(err.body.current).toEqual({ number: 4 });
  });

  it('falls back to a sentence built from the status when the body says nothing usable', () => {
    // A proxy's HTML page, a JSON string, an array, a number where the sentence should be.
    for (const body of [undefined, null, 'Bad Gateway', ['x'], { error: 42 }, { error: '' }, { field: 'title' }]) {
      const err = apiErrorFrom(502, body, (status) => `The server answered ${status}; try again.`);
      expect(err.error).toBe('The server answered 502; try again.');
      expect(err.status).toBe(502);
    }
  });

  it('never takes a field that is not text', () => {
    expect(apiErrorFrom(400, { error: 'No.', field: { evil: true } }).field).toBeUndefined();
  });

  it('uses a fixed fallback sentence as given', () => {
    expect(apiErrorFrom(500, {}, 'The venue could not be created.').error).toBe('The venue could not be created.');
  });
});
