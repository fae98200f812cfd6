import { describe, expect, it } from 'vitest';
import { renderDocHtml } from './render-html';
import type { PmNode } from './types';

const doc: PmNode = {
  type: 'doc',
  content: [
    { type: 'image', attrs: { src: '/files/abc123/display', alt: 'Rack <B>' } },
    { type: 'image', attrs: { src: '/files/kept99/display', alt: 'Patch bay' } },
  ],
};

describe('renderDocHtml with isImageAvailable', () => {
  it('shows a note, escaped, instead of a broken image for a file that is gone', () => {
    const html = renderDocHtml(doc, { isImageAvailable: (src) => src.includes('kept99') });
    expect(html).toContain('<span class="missing-photo" role="note">Photo removed: Rack &lt;B&gt;</span>');
    expect(html).toContain('<img src="/files/kept99/display" alt="Patch bay" loading="lazy" decoding="async"/>');
    expect(html).not.toContain('abc123');
  });

  it('renders every image when no check is given', () => {
    expect(renderDocHtml(doc).match(/<img /g)).toHaveLength(2);
  });

  it('shows the photo as a figure: caption from title or description, stored size, a link to the whole file', () => {
    const html = renderDocHtml(doc, { imageSize: (src) => (src.includes('kept99') ? { width: 1600, height: 1200 } : undefined) });
    expect(html).toContain('<figcaption>Patch bay</figcaption>');
    expect(html).toContain('width="1600" height="1200"');
    expect(html).toContain('<a class="photo-open" href="/files/kept99">');
  });

  it('leaves out a caption that is only the file name, and sends the guest link through imageUrl', () => {
    const named: PmNode = { type: 'doc', content: [{ type: 'image', attrs: { src: '/files/kept99/display', alt: 'IMG_2041.JPG' } }] };
    const html = renderDocHtml(named, { imageUrl: (src) => `/advance/tok${src}` });
    expect(html).not.toContain('<figcaption>');
    expect(html).toContain('href="/advance/tok/files/kept99"');
    expect(html).toContain('src="/advance/tok/files/kept99/display"');
  });
});
