import { describe, expect, test } from 'vitest';
import { accessSentence, allowed, publicAccess, rolesOf, signedIn } from './access.ts';

describe('rolesOf', () => {
  test('should read each role and the rows it is limited to from the shared abilities', () => {
    expect(rolesOf(allowed('read', 'Field'))).toEqual([
      { role: 'admin', scope: [] },
      { role: 'head', scope: [] },
      { role: 'foreman', scope: ['own district'] },
      { role: 'crew', scope: ['own district', 'own crew'] },
      { role: 'partner', scope: ['linked sites'] },
    ]);
  });

  test('should keep only the roles whose rules match the row the service checks', () => {
    // Listing users means reading others than oneself: a head may read only their own account.
    const list = allowed('read', 'User', { probe: (actor) => ({ districtId: actor.districtId ?? -1, id: -1 }) });
    expect(rolesOf(list)).toEqual([
      { role: 'admin', scope: [] },
      { role: 'foreman', scope: ['own district'] },
    ]);
  });

  test('should leave out the roles a service refuses beyond the abilities', () => {
    expect(rolesOf(allowed('read', 'WorkOrder', { except: ['crew', 'partner'] })).map((r) => r.role)).toEqual(['admin', 'head', 'foreman']);
  });
});

describe('accessSentence', () => {
  test('should say who in words', () => {
    expect(accessSentence(publicAccess())).toBe('Who: anyone; no sign-in needed.');
    expect(accessSentence(signedIn())).toBe('Who: any signed-in user.');
    expect(accessSentence(allowed('update', 'Standards', { note: 'One level at a time.' }))).toBe('Who: Administrator; Department head. One level at a time.');
  });

  test('should refuse to document a route nobody may call', () => {
    expect(() => accessSentence(allowed('update', 'AuditEntry'))).toThrow(/no role may update AuditEntry/);
  });
});
