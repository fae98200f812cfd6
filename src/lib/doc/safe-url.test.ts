import { describe, expect, it } from 'vitest';
import { isSafeLinkHref, linkKind } from './safe-url';

describe('link targets, resolved as a browser resolves them', () => {
  // Each of these is read by WHATWG URL parsing (and so by Chromium) as a link to another host.
  it.each(['/\\evil.example', '\\\\evil.example', '\\/evil.example', '//evil.example', '/\\/evil.example', ' //evil.example', '\\\\\\evil.example/x', 'https:evil.example', 'http:/evil.example', 'https:\\\\evil.example'])(
    '%j is refused',
    (href) => {
      expect(isSafeLinkHref(href)).toBe(false);
    },
  );
  it.each(['javascript:alert(1)', 'JaVaScRiPt:alert(1)', 'java\tscript:alert(1)', 'data:text/html,x', 'vbscript:x', 'file:///etc/passwd', '', 'x'.repeat(2049)])('%j is refused', (href) => {
    expect(isSafeLinkHref(href)).toBe(false);
  });
  it.each([
    ['/venues/haverkin-hall', 'internal'],
    ['/venues/a\\b', 'internal'],
    ['#top', 'internal'],
    ['?q=1', 'internal'],
    ['notes/stage', 'internal'],
    ['https://example.org/rider.pdf', 'external'],
    ['HTTP://example.org', 'external'],
    ['mailto:foh@example.org', 'external'],
  ] as const)('%j is %s', (href, kind) => {
    expect(linkKind(href)).toBe(kind);
  });
});
