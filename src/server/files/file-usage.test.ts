import { describe, expect, it } from 'vitest';
import { fileIdsInDoc } from './file-usage';

const id = '3f2b8c1e-9a7d-4c21-b0e5-6d4a2f1c8e90';

describe('fileIdsInDoc', () => {
  it('finds images and links to files, in every variant form', () => {
    const doc = JSON.stringify({
      type: 'doc',
      content: [
        { type: 'image', attrs: { src: `/files/${id}/display`, alt: 'rack' } },
        { type: 'paragraph', content: [{ type: 'text', text: 'plot', marks: [{ type: 'link', attrs: { href: '/files/abc_123' } }] }] },
        { type: 'image', attrs: { src: '/files/thumbonly/thumb' } },
      ],
    });
    expect([...fileIdsInDoc(doc)].sort()).toEqual([id, 'abc_123', 'thumbonly'].sort());
  });

  it('ignores look-alikes that are not this instance file route', () => {
    const doc = JSON.stringify({ text: '/filesystem/x and /files/ and /files/a.b' });
    expect([...fileIdsInDoc(doc)]).toEqual([]);
  });
});
