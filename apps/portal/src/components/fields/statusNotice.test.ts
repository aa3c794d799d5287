import { FIELD_STATUSES } from '@swardwise/domain';
import { describe, expect, test } from 'vitest';
import { statusNotice } from './statusNotice.ts';

describe('statusNotice', () => {
  test('should say nothing for an open field and something for every other status', () => {
    expect(statusNotice('open', 'field')).toBeNull();
    for (const s of FIELD_STATUSES.filter((s) => s !== 'open')) {
      expect(statusNotice(s, 'field')?.title, s).toBeTruthy();
      expect(statusNotice(s, 'booking')?.title, s).toBeTruthy();
    }
  });

  test('should tell a booking that a retired field is not kept any more', () => {
    expect(statusNotice('retired', 'booking')).toEqual({ type: 'error', title: 'This field is retired and no longer kept; book another field.' });
    expect(statusNotice('retired', 'field')?.title).toMatch(/week plan leaves it out/);
  });
});
