import type { CompareOutcomeKey, CompareParameterKey } from '@shared/constants/compare';
import type { HeatTreatment, RindTreatment, Species } from '@shared/constants/journal';
import { compareQuerySchema } from '@shared/schemas/compare';
import type { CompareResultDto } from '@shared/types/compare';
import { computed, onScopeDispose, ref, watch } from 'vue';
import { useRoute, useRouter, type LocationQuery, type LocationQueryRaw } from 'vue-router';
import { fetchComparison, type CompareParams } from '../api/compare';
import { ApiError } from '../api/http';

/** What the Compare page shows: the two keys, the unit of a point and Discover's filters. */
export type CompareChoice = {
  x: CompareParameterKey;
  y: CompareOutcomeKey;
  per: 'tasting' | 'journal';
  style: string[];
  species: Species[];
  heat: HeatTreatment[];
  rind: RindTreatment[];
  agingMin: number | null;
  agingMax: number | null;
  maker: string;
};

export const DEFAULT_CHOICE: CompareChoice = {
  x: 'saltPerLitre',
  y: 'overall',
  // One point per batch: a wheel tasted four times is still one batch (see ComparePickers).
  per: 'journal',
  style: [],
  species: [],
  heat: [],
  rind: [],
  agingMin: null,
  agingMax: null,
  maker: '',
};

const shape = compareQuerySchema.shape;

// Each key is read on its own, so one bad value in a shared link drops only that one.
function read<K extends keyof typeof shape>(query: LocationQuery, key: K): unknown {
  const raw = query[key];
  const value = Array.isArray(raw) ? raw.filter(Boolean).join(',') : (raw ?? undefined);
  const parsed = shape[key].safeParse(value === '' ? undefined : value);
  return parsed.success ? parsed.data : undefined;
}

/** Reads a comparison from a route query, falling back to the defaults for anything invalid. */
export function choiceFromQuery(query: LocationQuery): CompareChoice {
  const list = <T>(key: 'style' | 'species' | 'heat' | 'rind') =>
    ((read(query, key) as T[] | undefined) ?? []).filter((v, i, all) => all.indexOf(v) === i);
  const num = (key: 'agingMin' | 'agingMax') => (read(query, key) as number | undefined) ?? null;
  return {
    x: (read(query, 'x') as CompareParameterKey | undefined) ?? DEFAULT_CHOICE.x,
    y: (read(query, 'y') as CompareOutcomeKey | undefined) ?? DEFAULT_CHOICE.y,
    per: (read(query, 'per') as 'tasting' | 'journal' | undefined) ?? DEFAULT_CHOICE.per,
    style: list<string>('style'),
    species: list<Species>('species'),
    heat: list<HeatTreatment>('heat'),
    rind: list<RindTreatment>('rind'),
    agingMin: num('agingMin'),
    agingMax: num('agingMax'),
    maker: ((read(query, 'maker') as string | undefined) ?? '').replace(/^@/, ''),
  };
}

/** The comparison as API parameters; empty filters are left out. */
export function choiceToParams(c: CompareChoice): CompareParams {
  const params: CompareParams = { x: c.x, y: c.y, per: c.per };
  if (c.style.length) params.style = c.style;
  if (c.species.length) params.species = c.species;
  if (c.heat.length) params.heat = c.heat;
  if (c.rind.length) params.rind = c.rind;
  if (c.agingMin !== null) params.agingMin = c.agingMin;
  if (c.agingMax !== null) params.agingMax = c.agingMax;
  const maker = c.maker.trim().replace(/^@/, '').toLowerCase();
  if (maker) params.maker = maker;
  return params;
}

/** The comparison as a URL query: lists as "a,b", per only when it is not the default. */
export function choiceToQuery(c: CompareChoice): LocationQueryRaw {
  const query: LocationQueryRaw = {};
  for (const [key, value] of Object.entries(choiceToParams(c))) {
    if (key === 'per' && value === DEFAULT_CHOICE.per) continue;
    query[key] = Array.isArray(value) ? value.join(',') : String(value);
  }
  return query;
}

/** How many filters narrow the comparison (each style, milk, heat and rind counts once). */
export function activeFilterCount(c: CompareChoice): number {
  return (
    c.style.length +
    c.species.length +
    c.heat.length +
    c.rind.length +
    (c.agingMin !== null || c.agingMax !== null ? 1 : 0) +
    (c.maker ? 1 : 0)
  );
}

/**
 * One comparison whose parameter, outcome and filters live in the URL query (so a view can
 * be shared), loaded again whenever they change, with stale requests cancelled.
 */
export function useCompare(routeName = 'compare') {
  const route = useRoute();
  const router = useRouter();

  const choice = computed(() => choiceFromQuery(route.query));
  const activeCount = computed(() => activeFilterCount(choice.value));
  const result = ref<CompareResultDto | null>(null);
  const loading = ref(false);
  const error = ref<string | null>(null);
  let controller: AbortController | null = null;

  const params = computed(() => choiceToParams(choice.value));

  /** Loads the comparison for the current choice, cancelling any request still running. */
  async function load() {
    controller?.abort();
    const mine = new AbortController();
    controller = mine;
    loading.value = true;
    error.value = null;
    try {
      const dto = await fetchComparison(params.value, mine.signal);
      if (!mine.signal.aborted) result.value = dto;
    } catch (e) {
      if (mine.signal.aborted || (e as Error).name === 'AbortError') return;
      error.value = e instanceof ApiError ? e.message : 'Could not load the comparison.';
    } finally {
      if (controller === mine) {
        loading.value = false;
        controller = null;
      }
    }
  }

  /** Changes part of the comparison; the URL changes in place, so Back leaves the page. */
  function update(patch: Partial<CompareChoice>) {
    return router.replace({ name: routeName, query: choiceToQuery({ ...choice.value, ...patch }) });
  }

  /** Clears the filters, keeping the parameter, the outcome and the unit of a point. */
  function resetFilters() {
    const { x, y, per } = choice.value;
    return router.replace({
      name: routeName,
      query: choiceToQuery({ ...DEFAULT_CHOICE, x, y, per }),
    });
  }

  watch(
    () => (route.name === routeName ? JSON.stringify(params.value) : null),
    (key) => {
      if (key !== null) void load();
    },
    { immediate: true },
  );
  onScopeDispose(() => controller?.abort());

  return { choice, activeCount, result, loading, error, update, resetFilters, reload: load };
}
