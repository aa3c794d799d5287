import type { ImportKind, ImportRecord } from '@swardwise/domain';
import { computed, ref, shallowRef } from 'vue';
import { commitImport, listImports, undoImport, uploadImport } from '../api/imports.ts';
import { errorMessage } from '../api/messages.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';
import { useInvalidate } from './useInvalidate.ts';

/**
 * The imports page's state: upload a file for a preview (with upload progress), commit a
 * clean preview, undo the caller's last committed import, and the recent imports.
 */
export function useImport() {
  const kind = ref<ImportKind>('sites_csv');
  const current = shallowRef<ImportRecord | null>(null);
  const progress = ref<number | null>(null);
  const busy = ref<'upload' | 'commit' | 'undo' | null>(null);
  const error = ref<string | null>(null);
  const notice = ref<string | null>(null);
  const history = useApiQuery(queryKeys.imports(), listImports);
  const invalidate = useInvalidate();

  const canCommit = computed(() => {
    const c = current.value;
    return !!c && c.status === 'preview' && c.summary.errors === 0 && c.summary.create + c.summary.update > 0;
  });
  const lastCommitted = computed(() => {
    const id = history.data.value?.lastCommittedId;
    return id ? (history.data.value?.items.find((i) => i.id === id) ?? { id, fileName: `import ${id}` }) : null;
  });

  async function upload(file: File) {
    error.value = null;
    notice.value = null;
    current.value = null;
    busy.value = 'upload';
    progress.value = 0;
    try {
      current.value = await uploadImport(kind.value, file, (f) => (progress.value = f));
      progress.value = 1;
      void history.refetch();
    } catch (cause) {
      progress.value = null;
      error.value = errorMessage(cause);
    } finally {
      busy.value = null;
    }
  }

  async function commit() {
    if (!current.value) return;
    error.value = null;
    busy.value = 'commit';
    try {
      current.value = await commitImport(current.value.id);
      const s = current.value.summary;
      notice.value = `Imported ${current.value.fileName}: ${s.create} created, ${s.update} updated.`;
      // The sites and fields it wrote show on other pages too.
      await invalidate('import');
    } catch (cause) {
      error.value = errorMessage(cause);
    } finally {
      busy.value = null;
    }
  }

  async function undoLast() {
    const last = lastCommitted.value;
    if (!last) return;
    error.value = null;
    busy.value = 'undo';
    try {
      const undone = await undoImport(last.id);
      if (current.value?.id === undone.id) current.value = undone;
      notice.value = `Undid ${undone.fileName}: ${undone.changes?.created ?? 0} removed, ${undone.changes?.updated ?? 0} restored.`;
      await invalidate('import');
    } catch (cause) {
      error.value = errorMessage(cause);
    } finally {
      busy.value = null;
    }
  }

  function reset() {
    current.value = null;
    progress.value = null;
    error.value = null;
  }

  return { kind, current, progress, busy, error, notice, history, canCommit, lastCommitted, upload, commit, undoLast, reset };
}
