import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MAX_DISPLAY_NAME_CHARS, cleanDisplayName, withExtension } from './file-name';

describe('cleanDisplayName', () => {
  it.each([
    ['rack photo.jpg', 'rack photo.jpg'],
    ['../../etc/passwd.jpg', 'passwd.jpg'],
    ['C:\\Users\\sam\\Desktop\\amp rack.JPG', 'amp rack.JPG'],
    ['..', 'upload'],
    ['/', 'upload'],
    ['', 'upload'],
    ['   spaced    out   .png  ', 'spaced out .png'],
    ['line\nbreak\r\t.jpg', 'linebreak.jpg'],
    ['nul\u0000byte.pdf', 'nulbyte.pdf'],
    ['evil\u202Egpj.exe', 'evilgpj.exe'],
    ['zero\u200Bwidth.png', 'zerowidth.png'],
  ])('%j → %j', (raw, clean) => {
    expect(cleanDisplayName(raw)).toBe(clean);
  });

  it('normalises to NFC, so the same name typed on two systems compares equal', () => {
    const decomposed = 'Cafe\u0301 patch.pdf';
    expect(cleanDisplayName(decomposed)).toBe('Café patch.pdf');
    expect(cleanDisplayName(decomposed)).toBe(cleanDisplayName('Café patch.pdf'));
  });

  it('keeps the extension when it shortens a long name', () => {
    const cleaned = cleanDisplayName(`${'a'.repeat(300)}.jpeg`);
    expect(Array.from(cleaned)).toHaveLength(MAX_DISPLAY_NAME_CHARS);
    expect(cleaned.endsWith('.jpeg')).toBe(true);
  });

  it('never splits an emoji in half when shortening', () => {
    const cleaned = cleanDisplayName('🎛️'.repeat(200));
    expect(cleaned).toBe(cleaned.normalize('NFC'));
    expect(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])/.test(cleaned)).toBe(false);
  });

  it('non-text input becomes the fallback name', () => {
    expect(cleanDisplayName(undefined)).toBe('upload');
    expect(cleanDisplayName(42)).toBe('upload');
  });

  it('for any input: no separators, no controls, bounded, non-empty', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 400 }), (raw) => {
        const cleaned = cleanDisplayName(raw);
        expect(cleaned.length).toBeGreaterThan(0);
        expect(Array.from(cleaned).length).toBeLessThanOrEqual(MAX_DISPLAY_NAME_CHARS);
        expect(cleaned).not.toMatch(/[/\\\u0000-\u001f\u007f]/);
        expect(cleaned).not.toMatch(/^\.+$/);
      }),
    );
  });
});

describe('withExtension', () => {
  it('swaps or adds an extension', () => {
    expect(withExtension('IMG_0001.HEIC', 'jpg')).toBe('IMG_0001.jpg');
    expect(withExtension('rack', 'webp')).toBe('rack.webp');
    expect(withExtension('.hidden', 'webp')).toBe('.hidden.webp');
    expect(withExtension('plot v1.2 final', 'pdf')).toBe('plot v1.2 final.pdf');
    expect(withExtension('rack.jpg', '')).toBe('rack');
  });
});
