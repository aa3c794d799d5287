import { planRoute, type WorkOrderRow } from '@swardwise/domain';
import { describe, expect, test } from 'vitest';
import { order as sampleOrder } from '../components/week/sample.ts';
import { crewDays } from './todayRoute.ts';

const yard = { lat: 37.6, lng: -66.5 };
// Three sites on a line going east from the yard, listed out of order.
const positions = new Map([
  [1, { lat: 37.6, lng: -66.44 }],
  [2, { lat: 37.6, lng: -66.48 }],
  [3, { lat: 37.6, lng: -66.46 }],
]);
let nextId = 1;
/** A row without its site's position, so the sites the page loaded place it (or nothing does). */
function order(siteId: number, fieldName: string, plannedDate: string, plannedHours = 1): WorkOrderRow {
  const { siteLat: _lat, siteLng: _lng, ...row } = sampleOrder({ id: nextId++, fieldName, siteId, siteName: `Site ${siteId}`, plannedDate, crewId: 1, crewName: 'Crew', plannedHours, status: 'assigned', reason: '', details: {} });
  return row as WorkOrderRow;
}

describe('crewDays', () => {
  test('should order a day’s sites as the planner routes them and keep a site’s jobs together by field name', () => {
    const orders = [order(1, 'East B', '2026-06-01'), order(2, 'Near', '2026-06-01'), order(1, 'East A', '2026-06-01'), order(3, 'Middle', '2026-06-01', 2)];
    const [day] = crewDays(orders, '2026-06-01', yard, positions);
    const expected = planRoute(yard, [1, 2, 3].map((id) => ({ id, ...positions.get(id)! }))).order;
    expect(day!.stops.map((s) => s.siteId)).toEqual(expected);
    expect(expected).toEqual([2, 3, 1]);
    expect(day!.stops.at(-1)!.orders.map((o) => o.fieldName)).toEqual(['East A', 'East B']);
    expect(day!.plannedHours).toBe(5);
    expect(day!.label).toMatch(/^Today, Monday, Jun 1$/);
  });

  test('should drop past days, sort the days and put sites without a position after the routed ones', () => {
    const orders = [order(9, 'Unknown', '2026-06-02'), order(1, 'East', '2026-06-02'), order(2, 'Yesterday', '2026-05-31'), order(2, 'Later', '2026-06-04')];
    const days = crewDays(orders, '2026-06-01', yard, positions);
    expect(days.map((d) => d.date)).toEqual(['2026-06-02', '2026-06-04']);
    expect(days[0]!.label).toMatch(/^Tomorrow/);
    expect(days[0]!.stops.map((s) => s.siteId)).toEqual([1, 9]);
  });

  test('should keep the API’s order when the yard is unknown', () => {
    const orders = [order(1, 'A', '2026-06-01'), order(2, 'B', '2026-06-01')];
    expect(crewDays(orders, '2026-06-01', null, positions)[0]!.stops.map((s) => s.siteId)).toEqual([1, 2]);
  });
});
