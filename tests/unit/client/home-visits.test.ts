import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { homeVisits } from '@/lib/client/frame-queries';
import { freshDb } from './helpers';

const visit = (id: string, plannedOn: string | null) =>
  ({ id, farmId: 'f', plannedOn, advisorId: null, notes: '', status: 'scheduled', visitedAt: null, rev: 1, deletedAt: null, updatedAt: '' }) as const;

describe('the field home list', () => {
  it('shows a visit assigned without a date (after the dated ones, which come by date)', async () => {
    const db = freshDb();
    await db.visits.bulkPut([
      visit('33333333-3333-4333-8333-333333333333', null),
      visit('22222222-2222-4222-8222-222222222222', '2027-01-09'),
      visit('11111111-1111-4111-8111-111111111111', '2027-01-02'),
    ]);
    const { rows } = await homeVisits(db);
    expect(rows.map((r) => r.plannedOn)).toEqual(['2027-01-02', '2027-01-09', null]);
  });
});
