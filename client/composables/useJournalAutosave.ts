import { storeToRefs } from 'pinia';
import { onBeforeUnmount, onMounted, onScopeDispose, ref, watch } from 'vue';
import type { FormUnits, JournalForm } from './journalForm';
import { useJournalEditorStore } from '../stores/journalEditor';

const BACKUP_KEY = 'rindwise.journal-backup';
/** Quiet time after the last change before a draft is saved, ms. */
export const AUTOSAVE_DELAY_MS = 5000;
const BACKUP_DELAY_MS = 400;

export type JournalBackup = { units: FormUnits; form: JournalForm; at: string };

/** The batch typed before its first save, kept in this browser, or null. */
export function readJournalBackup(): JournalBackup | null {
  try {
    const text = localStorage.getItem(BACKUP_KEY);
    if (!text) return null;
    const backup = JSON.parse(text) as JournalBackup;
    return backup?.form && backup.units ? backup : null;
  } catch {
    return null;
  }
}

/** Forgets the browser's copy of an unsaved batch. */
export function clearJournalBackup() {
  try {
    localStorage.removeItem(BACKUP_KEY);
  } catch {
    // Storage refused: nothing was kept either.
  }
}

/**
 * Keeps the maker's typing safe: before the first save the form is copied to localStorage;
 * afterwards a draft is saved (PUT) after AUTOSAVE_DELAY_MS of quiet while it is dirty.
 * A published journal is saved only on request, so half-typed edits never go live.
 */
export function useJournalAutosave() {
  const editor = useJournalEditorStore();
  const { form, isNew, dirty, savedStatus, saving } = storeToRefs(editor);
  const lastAutosaveFailed = ref(false);
  let saveTimer: ReturnType<typeof setTimeout> | undefined;
  let backupTimer: ReturnType<typeof setTimeout> | undefined;

  function clearTimers() {
    clearTimeout(saveTimer);
    clearTimeout(backupTimer);
  }

  async function autosave() {
    if (!dirty.value || isNew.value || savedStatus.value !== 'draft') return;
    if (saving.value) {
      saveTimer = setTimeout(autosave, 1000);
      return;
    }
    const outcome = await editor.save({ quiet: true });
    // A conflict is shown on its own, with the choice; it is not a failed autosave.
    lastAutosaveFailed.value = outcome !== 'saved' && outcome !== 'conflict';
  }

  watch(
    form,
    () => {
      if (isNew.value) {
        if (!dirty.value) return;
        clearTimeout(backupTimer);
        backupTimer = setTimeout(() => {
          try {
            const backup: JournalBackup = {
              units: editor.units,
              form: form.value,
              at: new Date().toISOString(),
            };
            localStorage.setItem(BACKUP_KEY, JSON.stringify(backup));
          } catch {
            // Storage full or refused: the form itself still holds everything.
          }
        }, BACKUP_DELAY_MS);
        return;
      }
      if (savedStatus.value !== 'draft' || !dirty.value) return;
      clearTimeout(saveTimer);
      saveTimer = setTimeout(autosave, AUTOSAVE_DELAY_MS);
    },
    { deep: true },
  );

  // Once the journal exists on the server, the browser's copy is no longer needed.
  watch(isNew, (nowNew) => {
    if (!nowNew) clearJournalBackup();
  });

  function onBeforeUnload(event: BeforeUnloadEvent) {
    if (dirty.value && !isNew.value) event.preventDefault();
  }
  onMounted(() => window.addEventListener('beforeunload', onBeforeUnload));
  onBeforeUnmount(() => window.removeEventListener('beforeunload', onBeforeUnload));
  onScopeDispose(clearTimers);

  return { lastAutosaveFailed, cancelPending: clearTimers };
}
