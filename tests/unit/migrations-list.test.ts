import { readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { MIGRATIONS } from '@/migrations';

describe('migrations/index.ts', () => {
  it('lists every numbered migration file, in order, once', () => {
    const files = readdirSync(path.resolve(__dirname, '../../migrations'))
      .filter((f) => /^\d{4}-.*\.ts$/.test(f))
      .sort();
    expect(MIGRATIONS.map((m) => m.name)).toEqual(files);
  });
});
