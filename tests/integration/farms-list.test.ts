// The office's farms list: search by farm, area or farmer, sort, and each farm's stage.
import { describe, expect, it } from 'vitest';
import { listFarms } from '@/lib/server/data/farms';
import { makeOrganisation } from './support/fixtures';

describe('listFarms for the office', () => {
  it('finds a farm by its farmer’s name, sorts, and gives the latest visit’s stage', async () => {
    const o = await makeOrganisation('farmlist');
    const coordinator = { ...o.coordinator, units: 'metric' as const };
    const byFarmer = await listFarms(coordinator, { page: 1, pageSize: 50 }, { q: 'farmlist-farmer-2' });
    expect(byFarmer.items.map((f) => f.name)).toEqual(['farmlist farm 2']);
    expect(byFarmer.items[0]?.stage).toBe('scheduled');
    const none = await listFarms(coordinator, { page: 1, pageSize: 50 }, { q: '100%_nothing' });
    expect(none.total).toBe(0);
    const sorted = await listFarms(coordinator, { page: 1, pageSize: 50 }, { sort: 'name' });
    expect(sorted.items.map((f) => f.name)).toEqual(['farmlist farm', 'farmlist farm 2']);
  });
});
