import type { Visibility } from '@shared/constants/journal';
import { journalInputSchema, type JournalInput } from '@shared/schemas/journal';
import type { JournalDto, PhotoDto } from '@shared/types/journal';
import { formatQuantity, fromCelsius, fromMillimetres, type UnitSystem } from '@shared/trade';
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import * as journalsApi from '../api/journals';
import * as photosApi from '../api/photos';
import { ApiError } from '../api/http';
import { merge3, resolveConflicts, type MergeResult } from '../lib/merge3';
import {
  documentFromForm,
  emptyForm,
  formFromJournal,
  formUnitsFor,
  type FormUnits,
  type JournalForm,
} from '../composables/journalForm';

export type SaveOutcome = 'saved' | 'invalid' | 'failed' | 'conflict';

/** A save refused because the journal changed elsewhere, with both sides' values merged. */
export type EditorConflict = {
  current: JournalDto;
  theirs: JournalForm;
  result: MergeResult<JournalForm>;
};

const MERGE_OPTIONS = { ignoreKeys: ['key'], unionLists: ['weighIns'] } as const;
const clone = <T>(value: T): T => JSON.parse(JSON.stringify(value)) as T;

// Schema limits are in SI; a maker working in °F or inches should read their own numbers.
function localise(path: string, message: string, units: FormUnits, mouldUnit: string): string {
  const limit = /(at (?:least|most)) (-?[\d.]+)\./;
  const match = limit.exec(message);
  if (!match) return message;
  const value = Number(match[2]);
  let shown: string | null = null;
  if (/temp/i.test(path.split('.').pop() ?? ''))
    shown = formatQuantity(fromCelsius(value, units.temperature), units.temperature);
  else if (path.endsWith('cutSizeMm'))
    shown = formatQuantity(fromMillimetres(value, units.cut), units.cut);
  else if (path.startsWith('mould.'))
    shown = formatQuantity(fromMillimetres(value, mouldUnit as 'mm'), mouldUnit);
  return shown ? message.replace(limit, `$1 ${shown}.`) : message;
}

/** The journal being edited: the form in the member's units, its saved state and photos. */
export const useJournalEditorStore = defineStore('journalEditor', () => {
  const journalId = ref<number | null>(null);
  const units = ref<FormUnits>(formUnitsFor('metric'));
  const form = ref<JournalForm>(emptyForm(units.value));
  /** The status stored on the server; autosave runs only while this is a draft. */
  const savedStatus = ref<'draft' | 'published'>('draft');
  const snapshot = ref(JSON.stringify(form.value));
  const savedAt = ref<Date | null>(null);
  const saving = ref(false);
  const loading = ref(false);
  const loadError = ref<ApiError | null>(null);
  const errors = ref<Record<string, string>>({});
  const formError = ref<string | null>(null);
  const emailNotVerified = ref(false);
  const photos = ref<PhotoDto[]>([]);
  const title = ref('');
  /** The version of the journal the form was loaded from or last saved as (If-Match). */
  const version = ref<string | null>(null);
  /** The form as that version held it: the common base when a save meets a newer version. */
  const baseForm = ref<JournalForm | null>(null);
  const conflict = ref<EditorConflict | null>(null);
  /** What was merged in from elsewhere at the last save, for a short notice. */
  const mergedChanges = ref<string[]>([]);

  const dirty = computed(() => JSON.stringify(form.value) !== snapshot.value);
  const isNew = computed(() => journalId.value === null);

  function markSaved() {
    snapshot.value = JSON.stringify(form.value);
  }

  function reset(system: UnitSystem) {
    journalId.value = null;
    units.value = formUnitsFor(system);
    form.value = emptyForm(units.value);
    savedStatus.value = 'draft';
    savedAt.value = null;
    errors.value = {};
    formError.value = null;
    loadError.value = null;
    emailNotVerified.value = false;
    photos.value = [];
    title.value = '';
    version.value = null;
    baseForm.value = null;
    conflict.value = null;
    mergedChanges.value = [];
    markSaved();
  }

  function adopt(dto: JournalDto) {
    journalId.value = dto.id;
    form.value = formFromJournal(dto, units.value);
    savedStatus.value = dto.status;
    photos.value = [...dto.photos].sort((a, b) => a.position - b.position);
    title.value = dto.title;
    version.value = dto.version;
    baseForm.value = clone(form.value);
    conflict.value = null;
    markSaved();
  }

  // The journal changed elsewhere: merge its changes with the form. Different fields merge
  // by themselves (the save is tried again once); the same field changed on both sides waits
  // for the maker in `conflict`. Nothing typed here is dropped.
  function meetNewerVersion(current: JournalDto): 'merged' | 'conflict' {
    const theirs = formFromJournal(current, units.value);
    const result = merge3(baseForm.value ?? theirs, clone(form.value), theirs, MERGE_OPTIONS);
    version.value = current.version;
    baseForm.value = theirs;
    snapshot.value = JSON.stringify(theirs);
    title.value = current.title;
    photos.value = [...current.photos].sort((a, b) => a.position - b.position);
    savedStatus.value = current.status;
    if (result.conflicts.length) {
      conflict.value = { current, theirs, result };
      return 'conflict';
    }
    form.value = result.merged;
    mergedChanges.value = result.theirChanges;
    return 'merged';
  }

  /** Settles a conflict (keep this form's values, or the saved ones), then saves. */
  async function decideConflict(side: 'mine' | 'theirs'): Promise<SaveOutcome> {
    const c = conflict.value;
    if (!c) return 'failed';
    form.value = resolveConflicts(c.result, side);
    mergedChanges.value = c.result.theirChanges;
    conflict.value = null;
    formError.value = null;
    return save();
  }

  /** Starts a blank batch in the member's units (the view may then restore a backup). */
  function startNew(system: UnitSystem) {
    reset(system);
  }

  /** Loads one of the member's journals into the form; a journal they cannot edit is an error. */
  async function open(id: number, system: UnitSystem) {
    reset(system);
    loading.value = true;
    try {
      const dto = await journalsApi.fetchJournal(id);
      if (!dto.canEdit)
        throw new ApiError(403, 'FORBIDDEN', 'Only the maker can edit this journal.');
      adopt(dto);
      savedAt.value = new Date(dto.updatedAt);
    } catch (error) {
      loadError.value =
        error instanceof ApiError
          ? error
          : new ApiError(0, 'UNKNOWN', 'Could not load this journal.');
    } finally {
      loading.value = false;
    }
  }

  /** Checks the form with the shared schema; null with `errors` filled when it does not pass. */
  function validate(): JournalInput | null {
    const result = journalInputSchema.safeParse(documentFromForm(form.value, units.value));
    if (result.success) {
      errors.value = {};
      return result.data;
    }
    const next: Record<string, string> = {};
    for (const issue of result.error.issues) {
      const path = issue.path.join('.') || '_';
      next[path] ??= localise(path, issue.message, units.value, form.value.mould.unit);
    }
    errors.value = next;
    return null;
  }

  /**
   * Saves the whole document: creates the journal the first time, replaces it afterwards.
   * `publish` publishes it with that visibility. Field errors land in `errors`.
   */
  async function save(
    options: { publish?: Visibility; quiet?: boolean; retried?: boolean } = {},
  ): Promise<SaveOutcome> {
    if (saving.value) return 'failed';
    // Held until the maker settles it: autosave must not pick a side for them.
    if (conflict.value) return 'conflict';
    const previous = { status: form.value.status, visibility: form.value.visibility };
    if (options.publish) {
      form.value.status = 'published';
      form.value.visibility = options.publish;
    }
    const doc = validate();
    if (!doc) {
      Object.assign(form.value, previous);
      formError.value = options.quiet ? null : 'Some fields need attention; they are marked below.';
      return 'invalid';
    }
    saving.value = true;
    formError.value = null;
    // The maker may keep typing while the request is out: compare against what was sent.
    const sent = JSON.stringify(form.value);
    try {
      const dto =
        journalId.value === null
          ? await journalsApi.createJournal(doc)
          : await journalsApi.updateJournal(journalId.value, doc, version.value ?? '*');
      journalId.value = dto.id;
      version.value = dto.version;
      baseForm.value = formFromJournal(dto, units.value);
      savedStatus.value = dto.status;
      title.value = dto.title;
      photos.value = [...dto.photos].sort((a, b) => a.position - b.position);
      snapshot.value = sent;
      savedAt.value = new Date();
      emailNotVerified.value = false;
      return 'saved';
    } catch (error) {
      Object.assign(form.value, previous);
      const current = journalsApi.changedJournalOf(error);
      if (current) {
        saving.value = false;
        formError.value = null;
        if (meetNewerVersion(current) === 'conflict') return 'conflict';
        if (!options.retried) return save({ ...options, retried: true });
        formError.value =
          'The journal changed elsewhere again while saving. Both sets of changes are in the form now: save again.';
        return 'failed';
      }
      if (error instanceof ApiError) {
        if (error.code === 'EMAIL_NOT_VERIFIED') emailNotVerified.value = true;
        else if (Object.keys(error.fields).length) {
          errors.value = Object.fromEntries(
            Object.entries(error.fields).map(([path, message]) => [
              path,
              localise(path, message, units.value, form.value.mould.unit),
            ]),
          );
          formError.value = 'The server found problems in some fields; they are marked below.';
        } else formError.value = error.message;
      } else formError.value = 'Something went wrong while saving. Please try again.';
      return 'failed';
    } finally {
      saving.value = false;
    }
  }

  /** Sets the journal back to a private-to-you draft (autosave resumes). */
  async function unpublish(): Promise<SaveOutcome> {
    const before = form.value.status;
    form.value.status = 'draft';
    const outcome = await save();
    if (outcome !== 'saved') form.value.status = before;
    return outcome;
  }

  /** The message for one SI path of the document, e.g. "steps.2.targetTempC". */
  const feedback = (path: string) => errors.value[path];
  const status = (path: string) => (errors.value[path] ? ('error' as const) : undefined);

  /** Moves a row up (-1) or down (+1); row-indexed messages no longer fit, so they are cleared. */
  function moveRow<T>(rows: T[], index: number, delta: -1 | 1) {
    const target = index + delta;
    if (target < 0 || target >= rows.length) return;
    const [row] = rows.splice(index, 1);
    rows.splice(target, 0, row);
    errors.value = {};
  }

  function removeRow<T>(rows: T[], index: number) {
    rows.splice(index, 1);
    errors.value = {};
  }

  /** Uploads photos to the saved journal, reporting progress from 0 to 1. */
  async function addPhotos(files: File[], onProgress: (fraction: number) => void) {
    if (journalId.value === null) throw new Error('Save the journal before adding photos.');
    const added = await photosApi.uploadPhotos(journalId.value, files, [], onProgress);
    // The answer may hold the new photos or all of them; merging by id covers both.
    const byId = new Map(photos.value.map((p) => [p.id, p]));
    for (const photo of added) byId.set(photo.id, photo);
    photos.value = [...byId.values()].sort((a, b) => a.position - b.position);
  }

  /** Saves a photo's caption. */
  async function setCaption(photoId: number, caption: string) {
    if (journalId.value === null) return;
    await photosApi.updatePhotoCaption(journalId.value, photoId, caption);
    const photo = photos.value.find((p) => p.id === photoId);
    if (photo) photo.caption = caption;
  }

  /** Deletes a photo. */
  async function removePhoto(photoId: number) {
    if (journalId.value === null) return;
    await photosApi.deletePhoto(journalId.value, photoId);
    photos.value = photos.value.filter((p) => p.id !== photoId);
  }

  /** Moves a photo one place up or down and saves the order; the first photo is the cover. */
  async function movePhoto(index: number, delta: -1 | 1) {
    if (journalId.value === null) return;
    const target = index + delta;
    if (target < 0 || target >= photos.value.length) return;
    const before = [...photos.value];
    const next = [...photos.value];
    const [photo] = next.splice(index, 1);
    next.splice(target, 0, photo);
    photos.value = next;
    try {
      await photosApi.reorderPhotos(
        journalId.value,
        next.map((p) => p.id),
      );
    } catch (error) {
      photos.value = before;
      throw error;
    }
  }

  /** Replaces the form, e.g. with a backup kept in this browser before the first save. */
  function restore(saved: JournalForm, savedUnits: FormUnits) {
    units.value = savedUnits;
    form.value = saved;
  }

  return {
    journalId,
    units,
    form,
    savedStatus,
    savedAt,
    saving,
    loading,
    loadError,
    errors,
    formError,
    emailNotVerified,
    photos,
    title,
    version,
    conflict,
    mergedChanges,
    decideConflict,
    dirty,
    isNew,
    startNew,
    open,
    validate,
    save,
    unpublish,
    feedback,
    status,
    moveRow,
    removeRow,
    addPhotos,
    setCaption,
    removePhoto,
    movePhoto,
    restore,
  };
});
