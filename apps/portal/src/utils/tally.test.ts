import type { FieldStatus, Level } from '@swardwise/domain';
import { describe, expect, test } from 'vitest';
import { tallyByDistrict, tallyFields } from './tally.ts';

const field = (districtId: number, maintenanceLevel: Level, status: FieldStatus, areaM2 = 1000) => ({
  districtId,
  maintenanceLevel,
  status,
  areaM2,
});

describe('tallyFields', () => {
  test('should count fields per level and status, zero where there are none', () => {
    const t = tallyFields([field(1, 2, 'open'), field(1, 2, 'closed', 500), field(1, 4, 'restricted'), field(1, 3, 'retired', 250)]);
    expect(t.total).toBe(4);
    expect(t.areaM2).toBe(2750);
    expect(t.byLevel).toEqual({ 1: 0, 2: 2, 3: 1, 4: 1 });
    expect(t.byStatus).toEqual({ open: 1, restricted: 1, closed: 1, retired: 1 });
  });

  test('should keep each district’s fields apart', () => {
    const byDistrict = tallyByDistrict([field(1, 1, 'open'), field(2, 3, 'closed'), field(2, 3, 'open')]);
    expect(byDistrict.get(1)?.total).toBe(1);
    expect(byDistrict.get(2)?.byLevel[3]).toBe(2);
    expect(byDistrict.get(3)).toBeUndefined();
  });
});
