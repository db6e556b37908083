// The address the per-address sign-in limit counts: only what the configured proxies wrote into
// X-Forwarded-For; with none configured the header is the client's own text and is not read.
import { describe, expect, it } from 'vitest';
import { UNKNOWN_ADDRESS, clientAddress } from '@/lib/server/auth/client-address';

describe('clientAddress', () => {
  it('with no proxy configured (the default), X-Forwarded-For is ignored: every try is the one unknown address', () => {
    expect(clientAddress({ 'x-forwarded-for': '203.0.113.9' }, 0)).toBe(UNKNOWN_ADDRESS);
    expect(clientAddress({ 'x-forwarded-for': '1.2.3.4, 198.51.100.7' }, 0)).toBe(UNKNOWN_ADDRESS);
    expect(clientAddress({}, 0)).toBe(UNKNOWN_ADDRESS);
  });

  it('with one proxy, the last entry (the peer that proxy saw); with two, the one before it', () => {
    expect(clientAddress({ 'x-forwarded-for': '203.0.113.9' }, 1)).toBe('203.0.113.9');
    expect(clientAddress({ 'x-forwarded-for': 'made-up, 5.6.7.8, 198.51.100.7' }, 1)).toBe('198.51.100.7');
    expect(clientAddress({ 'x-forwarded-for': ['made-up', '198.51.100.7'] }, 1)).toBe('198.51.100.7');
    expect(clientAddress({ 'x-forwarded-for': 'made-up, 5.6.7.8, 198.51.100.7' }, 2)).toBe('5.6.7.8');
  });

  it('a header shorter than the proxies configured, or empty, is the unknown address; what is kept is capped', () => {
    expect(clientAddress({ 'x-forwarded-for': '198.51.100.7' }, 2)).toBe(UNKNOWN_ADDRESS);
    expect(clientAddress(undefined, 1)).toBe(UNKNOWN_ADDRESS);
    expect(clientAddress({ 'x-forwarded-for': ' ' }, 1)).toBe(UNKNOWN_ADDRESS);
    expect(clientAddress({ 'x-forwarded-for': 'x'.repeat(300) }, 1)).toHaveLength(64);
  });

  it('reads TRUSTED_PROXIES from the environment by default', () => {
    process.env.TRUSTED_PROXIES = '1';
    try {
      expect(clientAddress({ 'x-forwarded-for': '198.51.100.7' })).toBe('198.51.100.7');
    } finally {
      delete process.env.TRUSTED_PROXIES;
    }
    expect(clientAddress({ 'x-forwarded-for': '198.51.100.7' })).toBe(UNKNOWN_ADDRESS);
  });
});
