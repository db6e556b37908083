import { describe, expect, it } from 'vitest';
import { VISIT_STATUSES } from '@/lib/shared/domain';
import { VISIT_MOVES, canMove, nextStates } from '@/lib/shared/visit-states';

describe('the table of visit states', () => {
  it('has a row for every state and names only states', () => {
    expect(Object.keys(VISIT_MOVES).sort()).toEqual([...VISIT_STATUSES].sort());
    for (const moves of Object.values(VISIT_MOVES)) for (const to of Object.keys(moves)) expect(VISIT_STATUSES).toContain(to);
  });

  it('never lets a booked visit jump to running, nor the farmer read-and-agree in one', () => {
    for (const by of ['office', 'phone', 'farmer', 'app'] as const) expect(canMove('scheduled', 'commissioned', by)).toBe(false);
    expect(canMove('sent', 'acknowledged', 'farmer')).toBe(true);
    expect(canMove('acknowledged', 'agreed', 'farmer')).toBe(true);
    expect(canMove('acknowledged', 'agreed', 'office')).toBe(false);
  });

  it('offers the office only its own moves, in the life’s order', () => {
    expect(nextStates('scheduled', 'office')).toEqual(['requested', 'surveyed', 'cancelled']);
    expect(nextStates('commissioned', 'office')).toEqual([]);
  });
});
