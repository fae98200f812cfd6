import { describe, expect, it } from 'vitest';
import { MAX_UPLOAD_BYTES, uploadPrecheck } from './upload-limits';

describe('uploadPrecheck', () => {
  it('lets photos, PDFs and text traces through, by type or by name', () => {
    expect(uploadPrecheck({ name: 'rack.jpg', type: 'image/jpeg', size: 10 })).toBeNull();
    expect(uploadPrecheck({ name: 'IMG_1.HEIC', type: '', size: 10 })).toBeNull();
    expect(uploadPrecheck({ name: 'plot.pdf', type: 'application/pdf', size: 10 })).toBeNull();
    expect(uploadPrecheck({ name: 'sweep.csv', type: 'text/csv', size: 10 })).toBeNull();
  });

  it('flags what is certain to be refused, at once', () => {
    expect(uploadPrecheck({ name: 'show.mov', type: 'video/quicktime', size: 10 })).toMatch(/not a photo, a PDF or a measurement trace/);
    expect(uploadPrecheck({ name: 'big.jpg', type: 'image/jpeg', size: MAX_UPLOAD_BYTES + 1 })).toMatch(/larger than 25 MiB/);
    expect(uploadPrecheck({ name: 'exact.jpg', type: 'image/jpeg', size: MAX_UPLOAD_BYTES })).toBeNull();
    expect(uploadPrecheck({ name: 'empty.png', type: 'image/png', size: 0 })).toMatch(/empty/);
  });
});
