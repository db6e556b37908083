// The address the per-address sign-in limit counts: only the part of X-Forwarded-For the client
// could not write itself.
import { describe, expect, it } from 'vitest';
import { clientAddress } from '@/lib/server/auth/client-address';

describe('clientAddress', () => {
  it('takes the last X-Forwarded-For entry (the one Next or the nearest proxy wrote)', () => {
    expect(clientAddress({ 'x-forwarded-for': '203.0.113.9' })).toBe('203.0.113.9');
    expect(clientAddress({ 'x-forwarded-for': '1.2.3.4, 5.6.7.8, 198.51.100.7' })).toBe('198.51.100.7');
    expect(clientAddress({ 'x-forwarded-for': ['made-up', '198.51.100.7'] })).toBe('198.51.100.7');
  });

  it('falls back to "local" without the header, and caps what it stores', () => {
    expect(clientAddress({})).toBe('local');
    expect(clientAddress(undefined)).toBe('local');
    expect(clientAddress({ 'x-forwarded-for': ' ' })).toBe('local');
    expect(clientAddress({ 'x-forwarded-for': 'x'.repeat(300) })).toHaveLength(64);
  });
});
