import { describe, expect, it } from 'vitest';
import { keyboardInset } from './keyboard-inset';

// Figures of a 390 × 844 phone: a soft keyboard takes roughly 300–340 px (common practice for
// phone layouts; the exact height varies by device and language).
describe('keyboardInset', () => {
  it('is 0 with no keyboard, or where the layout itself shrank for it', () => {
    expect(keyboardInset(844, { height: 844, offsetTop: 0 })).toBe(0);
    expect(keyboardInset(508, { height: 508, offsetTop: 0 })).toBe(0);
  });
  it('lifts the save bar by the covered height when only the visual viewport shrank', () => {
    expect(keyboardInset(844, { height: 508, offsetTop: 0 })).toBe(336);
  });
  it('counts the visual viewport scrolled down inside the layout (the page pans to the cursor)', () => {
    expect(keyboardInset(844, { height: 508, offsetTop: 120 })).toBe(216);
  });
  it('ignores small changes from browser bars and pinch-zoom rounding', () => {
    expect(keyboardInset(844, { height: 790.5, offsetTop: 0 })).toBe(0);
    expect(keyboardInset(844, { height: 900, offsetTop: 0 })).toBe(0);
  });
});
