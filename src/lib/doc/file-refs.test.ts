import { describe, expect, it } from 'vitest';
import { fileIdsInDoc, fileRefsInDoc } from './file-refs';
import type { PmNode } from './types';

const text = (t: string, href?: string): PmNode => ({ type: 'text', text: t, ...(href ? { marks: [{ type: 'bold' }, { type: 'link', attrs: { href } }] } : {}) });

describe('fileRefsInDoc', () => {
  it('finds photos and links to /files/… anywhere in the tree, in reading order', () => {
    const doc: PmNode = {
      type: 'doc',
      content: [
        { type: 'image', attrs: { src: '/files/rack_1/display', alt: 'Amp rack' } },
        { type: 'paragraph', content: [text('see the '), text('stage plot', '/files/plot-2?download=1')] },
        {
          type: 'table',
          content: [{ type: 'tableRow', content: [{ type: 'tableCell', content: [{ type: 'image', attrs: { src: '/files/deep3' } }] }] }],
        },
      ],
    };
    expect(fileRefsInDoc(doc)).toEqual([
      { kind: 'photo', fileId: 'rack_1', url: '/files/rack_1/display', label: 'Amp rack' },
      { kind: 'link', fileId: 'plot-2', url: '/files/plot-2?download=1', label: 'stage plot' },
      { kind: 'photo', fileId: 'deep3', url: '/files/deep3', label: '' },
    ]);
  });

  it('ignores text that only mentions a file address, other hosts, and other site paths', () => {
    const doc: PmNode = {
      type: 'doc',
      content: [
        { type: 'paragraph', content: [text('the old link was /files/abc/display')] },
        { type: 'paragraph', content: [text('elsewhere', 'https://example.org/files/abc'), text('venue', '/venues/hall/files')] },
      ],
    };
    expect(fileRefsInDoc(doc)).toEqual([]);
  });
});

describe('fileIdsInDoc', () => {
  const id = '3f2b8c1e-9a7d-4c21-b0e5-6d4a2f1c8e90';

  it('finds images and links to files, in every variant form, each id once', () => {
    const doc: PmNode = {
      type: 'doc',
      content: [
        { type: 'image', attrs: { src: `/files/${id}/display`, alt: 'rack' } },
        { type: 'image', attrs: { src: `/files/${id}/thumb` } },
        { type: 'paragraph', content: [text('plot', '/files/abc_123'), text('rider', '/files/rider#page=2')] },
        { type: 'image', attrs: { src: '/files/thumbonly/thumb' } },
      ],
    };
    expect([...fileIdsInDoc(doc)].sort()).toEqual([id, 'abc_123', 'rider', 'thumbonly'].sort());
  });

  it('does not count a page that only mentions a file address in its text', () => {
    const doc: PmNode = { type: 'doc', content: [{ type: 'paragraph', content: [text(`the photo used to be at /files/${id}/display and "/files/abc123"`)] }] };
    expect([...fileIdsInDoc(doc)]).toEqual([]);
  });

  it('ignores look-alikes that are not this instance’s file route', () => {
    const doc: PmNode = {
      type: 'doc',
      content: [
        { type: 'paragraph', content: [text('a', '/filesystem/x'), text('b', '/files/'), text('c', '/files/a.b'), text('d', 'files/abc'), text('e', '/venues/files/abc')] },
        { type: 'image', attrs: { src: { toString: () => '/files/abc' } } },
      ],
    };
    expect([...fileIdsInDoc(doc)]).toEqual([]);
  });
});
