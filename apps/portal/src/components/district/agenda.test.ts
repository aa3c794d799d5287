import type { FieldRow, MapField } from '@swardwise/domain';
import { describe, expect, test } from 'vitest';
import { order } from '../week/sample.ts';
import { withCare } from '../fields/fieldCare.ts';
import { districtAgenda } from './agenda.ts';

const TODAY = '2026-12-02';
const field = (id: number, name: string, status = 'open') => ({ id, name, siteId: 1, siteName: 'Alder Park', districtId: 1, districtName: 'North', status, statusNote: '' }) as unknown as FieldRow;
const care = (id: number, m: Partial<MapField>) => ({ id, lastMowedOn: null, mowDueOn: null, mowDueState: 'ok', mowWaitingForGrowth: false, overdue: false, checkDueOn: '2026-12-20', checkState: 'ok', score: null, scoredOn: null, ...m }) as MapField;

describe('districtAgenda', () => {
  test('should list today\u2019s work, late work, overdue fields, checks due and closures', () => {
    const rows = withCare(
      [field(1, 'Ash 1'), field(2, 'Ash 2'), field(3, 'Ash 3', 'closed'), field(4, 'Ash 4')],
      [
        care(1, { mowDueOn: '2026-11-29', mowDueState: 'overdue' }),
        care(2, { checkDueOn: '2026-11-10', checkState: 'overdue' }),
        care(3, {}),
        care(4, { checkDueOn: TODAY, checkState: 'due' }),
      ],
    );
    const orders = [
      order({ id: 1, plannedDate: TODAY }),
      order({ id: 2, plannedDate: TODAY, status: 'done' }),
      order({ id: 3, plannedDate: '2026-11-30', status: 'assigned' }),
      order({ id: 4, plannedDate: '2026-12-01', status: 'skipped' }),
      order({ id: 5, plannedDate: '2026-12-03' }),
    ];
    const a = districtAgenda(rows, orders, TODAY);
    expect(a.dueToday.map((o) => o.id)).toEqual([1]);
    expect(a.lateWork.map((o) => o.id)).toEqual([3]);
    expect(a.mowingOverdue.map((f) => f.name)).toEqual(['Ash 1']);
    expect(a.checksOverdue.map((f) => f.name)).toEqual(['Ash 2']);
    expect(a.checksDue.map((f) => f.name)).toEqual(['Ash 4']);
    expect(a.closures.map((f) => f.name)).toEqual(['Ash 3']);
  });
});
