import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { localSocket } from '@/lib/server/db/connection';
import { utcDate } from '@/models/batch-insert';

describe('how the app reaches its database', () => {
  const socket = path.join(mkdtempSync(path.join(tmpdir(), 'fallbook-sock-')), 'db.sock');
  writeFileSync(socket, '');

  it('takes the Unix socket only for a server on this machine, with no replicas, when the socket exists', () => {
    expect(localSocket({ DB_SOCKET: socket, DB_HOST: '127.0.0.1', DB_READ_HOSTS: '' })).toEqual({ socketPath: socket });
    expect(localSocket({ DB_SOCKET: socket, DB_HOST: 'localhost', DB_READ_HOSTS: '' })).toEqual({ socketPath: socket });
    expect(localSocket({ DB_SOCKET: socket, DB_HOST: 'db.internal', DB_READ_HOSTS: '' })).toEqual({});
    expect(localSocket({ DB_SOCKET: socket, DB_HOST: '127.0.0.1', DB_READ_HOSTS: '127.0.0.1:3309' })).toEqual({});
    expect(localSocket({ DB_SOCKET: `${socket}.gone`, DB_HOST: '127.0.0.1', DB_READ_HOSTS: '' })).toEqual({});
    expect(localSocket({ DB_SOCKET: '', DB_HOST: '127.0.0.1', DB_READ_HOSTS: '' })).toEqual({});
  });

  it('reads a DATETIME as the UTC connections send it, with or without fractions', () => {
    expect(utcDate('2026-08-01 10:00:00').toISOString()).toBe('2026-08-01T10:00:00.000Z');
    expect(utcDate('2026-12-31 23:59:59.123').toISOString()).toBe('2026-12-31T23:59:59.123Z');
    expect(utcDate('2024-02-29 00:00:00.5').toISOString()).toBe('2024-02-29T00:00:00.500Z');
  });
});
