import { describe, expect, test } from 'vitest';
import { auditAttributeLabel, auditEntityLabel, auditReferences, auditValueText, describeAuditChanges, type AuditNames } from './audit-words.ts';

const names: AuditNames = {
  user: new Map([[7, 'Rosa Quill']]),
  crew: new Map([
    [1, 'Crew A'],
    [2, 'Crew B'],
  ]),
  site: new Map([
    [3, 'Larkspur Park'],
    [4, 'Fenwick School'],
  ]),
  field: new Map([[9, 'Meadow 1 (Larkspur Park)']]),
};

describe('audit in words', () => {
  test('should list only the attributes an update changed, with ids named', () => {
    const changes = describeAuditChanges(
      { id: 5, version: 3, updatedAt: '2026-09-14T10:00:00.000Z', crewId: 1, fieldId: 9, plannedDate: '2026-09-14', task: 'mow', hours: 1.5 },
      { id: 5, version: 4, updatedAt: '2026-09-14T11:00:00.000Z', crewId: 2, fieldId: 9, plannedDate: '2026-09-15', task: 'mow', hours: 1.5 },
      names,
    );
    expect(changes).toEqual([
      { attribute: 'crewId', label: 'Crew', before: 'Crew A', after: 'Crew B' },
      { attribute: 'plannedDate', label: 'Planned date', before: '2026-09-14', after: '2026-09-15' },
    ]);
  });

  test('should word levels, tasks, yes/no, lists of sites, empty values and removed rows', () => {
    expect(auditValueText('maintenanceLevel', 1)).toBe('Showcase');
    expect(auditValueText('task', 'paint_lines')).toBe('Paint lines');
    expect(auditValueText('active', false)).toBe('no');
    expect(auditValueText('siteIds', [3, 4], names)).toBe('Larkspur Park, Fenwick School');
    expect(auditValueText('decidedBy', 7, names)).toBe('Rosa Quill');
    expect(auditValueText('crewId', 99, names)).toBe('#99 (removed)');
    expect(auditValueText('notes', null)).toBe('—');
    expect(auditValueText('fromAt', '2026-09-14T18:30:00.000Z')).toBe('2026-09-14 18:30 UTC');
  });

  test('should list what a creation set and what a removal took, leaving out empty values', () => {
    expect(describeAuditChanges(null, { id: 1, name: 'Meadow 2', notes: null, siteId: 3 }, names)).toEqual([
      { attribute: 'name', label: 'Name', before: '—', after: 'Meadow 2' },
      { attribute: 'siteId', label: 'Site', before: '—', after: 'Larkspur Park' },
    ]);
    expect(describeAuditChanges({ id: 1, name: 'Meadow 2', notes: null }, null)).toEqual([{ attribute: 'name', label: 'Name', before: 'Meadow 2', after: '—' }]);
  });

  test('should show nested settings one attribute at a time, and lists of rates with names', () => {
    const changes = describeAuditChanges(
      { fuelLPerHour: { reel_mower: 4, rotary_mower: 6 }, crewRates: [] },
      { fuelLPerHour: { reel_mower: 4.5, rotary_mower: 6 }, crewRates: [{ crewId: 2, ratePerHour: 52.5 }] },
      names,
    );
    expect(changes).toEqual([
      { attribute: 'fuelLPerHour.reel_mower', label: 'Fuel per machine hour (L) · Reel mower', before: '4', after: '4.5' },
      { attribute: 'crewRates', label: 'Crew rates per hour', before: '—', after: 'Crew B 52.5' },
    ]);
    expect([...auditReferences([{ before: null, after: { crewRates: [{ crewId: 2, ratePerHour: 1 }] } }]).crew]).toEqual([2]);
  });

  test('should name attributes and kinds in words', () => {
    expect(auditAttributeLabel('hocMm')).toBe('Height of cut (mm)');
    expect(auditAttributeLabel('expectedReopenAt')).toBe('Expected reopening');
    expect(auditAttributeLabel('decidedBy')).toBe('Decided by');
    expect(auditAttributeLabel('weedCoverPct')).toBe('Weed cover (%)');
    expect(auditAttributeLabel('heightMm')).toBe('Height (mm)');
    expect(auditAttributeLabel('shiftAlongM')).toBe('Shift along (m)');
    expect(auditEntityLabel('work_order')).toBe('Work order');
    expect(auditEntityLabel('field_stripes')).toBe('Stripe pattern');
  });

  test('should collect every referenced id by kind, once', () => {
    const refs = auditReferences([
      { before: { crewId: 1, siteIds: [3, 4] }, after: { crewId: 2, decidedBy: 7 } },
      { before: null, after: { crewId: 1, fieldId: 9 } },
    ]);
    expect([...refs.crew].sort()).toEqual([1, 2]);
    expect([...refs.site].sort()).toEqual([3, 4]);
    expect([...refs.user]).toEqual([7]);
    expect([...refs.field]).toEqual([9]);
  });
});
