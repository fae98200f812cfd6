import { describe, expect, it } from 'vitest';
import { contentDisposition } from './content-disposition';

describe('contentDisposition', () => {
  it('plain ASCII names appear twice, the same', () => {
    expect(contentDisposition('inline', 'amp rack.jpg')).toBe(`inline; filename="amp rack.jpg"; filename*=UTF-8''amp%20rack.jpg`);
  });

  it('non-ASCII names get an ASCII fallback and an exact UTF-8 form', () => {
    const value = contentDisposition('attachment', 'Bühne – Plan (v2).pdf');
    expect(value).toBe(`attachment; filename="Buhne _ Plan (v2).pdf"; filename*=UTF-8''B%C3%BChne%20%E2%80%93%20Plan%20%28v2%29.pdf`);
  });

  it('quotes, backslashes and semicolons cannot break out of the header value', () => {
    const value = contentDisposition('inline', 'a";b\\c;d.jpg');
    expect(value.startsWith('inline; filename="a__b_c_d.jpg"; ')).toBe(true);
    expect(value).toContain(`filename*=UTF-8''a%22%3Bb%5Cc%3Bd.jpg`);
  });

  it('a name with nothing printable still gets a usable fallback', () => {
    expect(contentDisposition('inline', '照片.jpg')).toContain('filename="__.jpg"');
    expect(contentDisposition('inline', '照片')).toContain('filename="download"');
  });
});
