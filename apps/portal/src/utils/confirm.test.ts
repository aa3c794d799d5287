import { ElMessageBox } from 'element-plus';
import { afterEach, describe, expect, test, vi } from 'vitest';
import { confirmed } from './confirm.ts';

describe('confirmed', () => {
  afterEach(() => vi.restoreAllMocks());

  test('should ask with the buttons named and say true when the person goes ahead', async () => {
    const ask = vi.spyOn(ElMessageBox, 'confirm').mockResolvedValue('confirm' as never);
    expect(await confirmed('North Lawn will be removed.', 'Delete North Lawn?', { confirm: 'Delete', danger: true })).toBe(true);
    expect(ask).toHaveBeenCalledWith('North Lawn will be removed.', 'Delete North Lawn?', { confirmButtonText: 'Delete', cancelButtonText: 'Cancel', type: 'warning', confirmButtonClass: 'el-button--danger' });
  });

  test('should say false when the person backs out, and keep an ordinary button where nothing is removed', async () => {
    const ask = vi.spyOn(ElMessageBox, 'confirm').mockRejectedValue('cancel');
    expect(await confirmed('Rows come back.', 'Undo last import', { confirm: 'Undo import', cancel: 'Keep it', type: 'info' })).toBe(false);
    expect(ask).toHaveBeenCalledWith('Rows come back.', 'Undo last import', { confirmButtonText: 'Undo import', cancelButtonText: 'Keep it', type: 'info' });
  });
});
