import type { ImportKind, ImportRecord } from '@swardwise/domain';
import { computed, ref, shallowRef } from 'vue';
import { commitImport, listImports, undoImport, uploadImport } from '../api/imports.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useAction } from './useAction.ts';
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
  const { busyFor: busy, failure: error, runFor } = useAction<'upload' | 'commit' | 'undo'>();
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
    await runFor(
      'upload',
      async () => {
        notice.value = null;
        current.value = null;
        progress.value = 0;
        current.value = await uploadImport(kind.value, file, (f) => (progress.value = f));
        progress.value = 1;
        void history.refetch();
      },
      () => {
        progress.value = null;
      },
    );
  }

  async function commit() {
    const preview = current.value;
    if (!preview) return;
    await runFor('commit', async () => {
      current.value = await commitImport(preview.id);
      const s = current.value.summary;
      notice.value = `Imported ${current.value.fileName}: ${s.create} created, ${s.update} updated.`;
      // The sites and fields it wrote show on other pages too.
      await invalidate('import');
    });
  }

  async function undoLast() {
    const last = lastCommitted.value;
    if (!last) return;
    await runFor('undo', async () => {
      const undone = await undoImport(last.id);
      if (current.value?.id === undone.id) current.value = undone;
      notice.value = `Undid ${undone.fileName}: ${undone.changes?.created ?? 0} removed, ${undone.changes?.updated ?? 0} restored.`;
      await invalidate('import');
    });
  }

  function reset() {
    current.value = null;
    progress.value = null;
    error.value = null;
  }

  return { kind, current, progress, busy, error, notice, history, canCommit, lastCommitted, upload, commit, undoLast, reset };
}
