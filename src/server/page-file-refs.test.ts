import { describe, expect, it } from 'vitest';
import type { PmNode } from '~/lib/doc/types';
import { fileRefsInDoc } from './page-file-refs';

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
