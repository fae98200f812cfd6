import { describe, expect, it } from 'vitest';
import { clientAddressFor, parseTrustedProxies } from './client-address.mjs';

describe('clientAddressFor', () => {
  const none = parseTrustedProxies('');
  const proxy = parseTrustedProxies('10.0.0.2, ::1');

  it('ignores X-Forwarded-For entirely when no proxy is trusted', () => {
    expect(clientAddressFor('203.0.113.9', '198.51.100.1', none)).toBe('203.0.113.9');
    expect(clientAddressFor('::ffff:127.0.0.1', '1.2.3.4, 5.6.7.8', none)).toBe('127.0.0.1');
  });

  it('behind a trusted proxy takes the right-most hop the proxy did not write itself', () => {
    expect(clientAddressFor('10.0.0.2', 'spoofed, 198.51.100.7', proxy)).toBe('198.51.100.7');
    expect(clientAddressFor('10.0.0.2', '198.51.100.7, 10.0.0.2', proxy)).toBe('198.51.100.7');
  });

  it('falls back to the proxy itself when the header is missing or only names proxies', () => {
    expect(clientAddressFor('10.0.0.2', undefined, proxy)).toBe('10.0.0.2');
    expect(clientAddressFor('10.0.0.2', '::1', proxy)).toBe('10.0.0.2');
  });

  it('does not trust a header from a peer that is not the named proxy', () => {
    expect(clientAddressFor('192.0.2.50', '10.0.0.2', proxy)).toBe('192.0.2.50');
  });
});
