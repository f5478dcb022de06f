import { tastingInputSchema } from '@shared/schemas/tasting';
import { typicalTraitsOf } from '@shared/constants/tasting';
import type { JournalDto } from '@shared/types/journal';
import type { TastingDto } from '@shared/types/tasting';
import { onScopeDispose, ref, toValue, watch, type MaybeRefOrGetter } from 'vue';
import { ApiError } from '../api/http';
import { fetchJournal } from '../api/journals';
import { createTasting, listTastings, updateTasting } from '../api/tastings';
import { todayIso } from './tastingDisplay';
import { useZodForm } from './useZodForm';

// A score the taster has not chosen yet: the schema refuses it with "Score … from 1 to 9".
// Starting at 5 would put a neutral score on every attribute nobody looked at.
const UNSCORED = undefined as unknown as number;

/**
 * The scorecard for one journal: loads the journal (title, make date, milk) and, when
 * editing, the taster's tasting; validates with the shared schema; creates or changes it.
 */
export function useTastingForm(
  journalId: MaybeRefOrGetter<number>,
  editId: MaybeRefOrGetter<number | null>,
  invite: MaybeRefOrGetter<string | null>,
) {
  const journal = ref<JournalDto | null>(null);
  const editing = ref<TastingDto | null>(null);
  const loading = ref(true);
  const notFound = ref(false);
  const loadError = ref<string | null>(null);
  const form = useZodForm(tastingInputSchema, {
    tastedOn: todayIso(),
    overall: UNSCORED,
    appearance: UNSCORED,
    aroma: UNSCORED,
    flavour: UNSCORED,
    texture: UNSCORED,
    finish: UNSCORED,
    descriptors: [],
    defects: [],
    notes: '',
    invite: undefined,
  });
  let controller: AbortController | null = null;

  async function load() {
    controller?.abort();
    const mine = new AbortController();
    controller = mine;
    loading.value = true;
    notFound.value = false;
    loadError.value = null;
    try {
      const id = toValue(journalId);
      const edit = toValue(editId);
      const [dto, list] = await Promise.all([
        fetchJournal(id, mine.signal),
        edit ? listTastings(id, mine.signal) : Promise.resolve(null),
      ]);
      if (mine.signal.aborted) return;
      journal.value = dto;
      editing.value = list?.tastings.find((t) => t.id === edit && t.canEdit) ?? null;
      if (edit && !editing.value) notFound.value = true;
      if (editing.value) {
        const t = editing.value;
        Object.assign(form.values, {
          tastedOn: t.tastedOn,
          overall: t.overall,
          appearance: t.appearance,
          aroma: t.aroma,
          flavour: t.flavour,
          texture: t.texture,
          finish: t.finish,
          descriptors: [...t.descriptors],
          // A style's own trait (crumbly for a Caerphilly-type) is no longer a defect for it.
          defects: t.defects.filter((d) => !typicalTraitsOf(dto.style.slug).has(d)),
          notes: t.notes,
        });
      }
    } catch (e) {
      if (mine.signal.aborted || (e as Error).name === 'AbortError') return;
      if (e instanceof ApiError && (e.status === 404 || e.status === 403)) notFound.value = true;
      else loadError.value = e instanceof ApiError ? e.message : 'Could not load this journal.';
    } finally {
      if (controller === mine) loading.value = false;
    }
  }

  /** Saves the scorecard; resolves true when the server took it. */
  async function save(): Promise<boolean> {
    let saved = false;
    form.values.invite = toValue(invite) || undefined;
    await form.submit(async (data) => {
      const id = toValue(journalId);
      if (editing.value) {
        const { invite: _invite, ...patch } = data;
        await updateTasting(editing.value.id, patch);
      } else await createTasting(id, data);
      saved = true;
    });
    return saved;
  }

  watch(() => [toValue(journalId), toValue(editId)], load, { immediate: true });
  onScopeDispose(() => controller?.abort());

  return { journal, editing, loading, notFound, loadError, form, save };
}
