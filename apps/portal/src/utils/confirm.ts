import { ElMessageBox } from 'element-plus';

export interface ConfirmChoice {
  /** The button that goes ahead, saying what it does ("Delete", "Undo import"). */
  confirm: string;
  /** The button that backs out; "Cancel" unless the choice reads better otherwise ("Keep it"). */
  cancel?: string;
  /** 'warning' (the default) for what cannot be taken back, 'info' otherwise. */
  type?: 'warning' | 'info';
  /** The go-ahead button turns red: it deletes or takes something away. */
  danger?: boolean;
}

/** Asks before an action: true when the person goes ahead, false when they back out or close the box. */
export async function confirmed(message: string, title: string, choice: ConfirmChoice): Promise<boolean> {
  try {
    await ElMessageBox.confirm(message, title, {
      confirmButtonText: choice.confirm,
      cancelButtonText: choice.cancel ?? 'Cancel',
      type: choice.type ?? 'warning',
      ...(choice.danger ? { confirmButtonClass: 'el-button--danger' } : {}),
    });
    return true;
  } catch {
    return false;
  }
}
