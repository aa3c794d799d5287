import { describe, expect, test } from 'vitest';
import { ApiError } from './client.ts';
import { isApiErrorCode } from '@swardwise/domain';
import { MESSAGES, errorMessage, hasCode, isConflict, messageFor } from './messages.ts';

describe('messages', () => {
  test('should word every version conflict the same way, naming the resource of its code', () => {
    expect(messageFor('site/version_conflict')).toBe('Someone else changed this site since you opened it; reload to see their change, then make yours again.');
    expect(messageFor('work_order/version_conflict')).toMatch(/this work order since/);
    expect(messageFor('equipment/version_conflict')).toMatch(/this machine since/);
    expect(messageFor('something_new/version_conflict')).toMatch(/this item since/);
    expect(isConflict(new ApiError(409, 'crew/version_conflict', 'stale'))).toBe(true);
    expect(isConflict(new ApiError(409, 'crew/has_lead', 'move the lead first'))).toBe(false);
  });

  test('should show the portal’s own message for a known code and the server’s for any other', () => {
    expect(errorMessage(new ApiError(401, 'auth/invalid_credentials', 'wrong'))).toBe('The e-mail or password is not right. Check both and try again.');
    expect(errorMessage(new ApiError(429, 'http/429', 'The server answered 429.'))).toMatch(/^Too many sign-in attempts/);
    expect(errorMessage(new ApiError(413, 'http/413', 'The server answered 413.'))).toBe('The file is too large to upload.');
    expect(errorMessage(new ApiError(409, 'crew/has_lead', 'Move the crew lead first'))).toBe('Move the crew lead first');
    expect(errorMessage(new Error('boom'))).toBe('boom');
  });

  test('should key its messages by codes the API answers with, or by the portal’s own', () => {
    const keys = Object.keys(MESSAGES);
    expect(keys.length).toBeGreaterThan(10);
    for (const code of keys) expect(isApiErrorCode(code) || /^(http\/\d{3}|network\/unreachable)$/.test(code), code).toBe(true);
  });

  test('should tell an answer of one code from others', () => {
    expect(hasCode(new ApiError(409, 'field/has_work_history', 'retire it'), 'field/has_work_history')).toBe(true);
    expect(hasCode(new ApiError(409, 'field/version_conflict', 'stale'), 'field/has_work_history')).toBe(false);
    expect(hasCode(new Error('field/has_work_history'), 'field/has_work_history')).toBe(false);
  });
});
