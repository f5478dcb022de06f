import type { HeatTreatment, JournalSort, RindTreatment, Species } from '@shared/constants/journal';
import { journalListQuerySchema } from '@shared/schemas/journal';
import { computed, onScopeDispose, ref, watch } from 'vue';
import { useRoute, useRouter, type LocationQuery, type LocationQueryRaw } from 'vue-router';
import { listJournals, toQuery, type JournalListParams, type JournalPage } from '../api/journals';
import { ApiError } from '../api/http';

/** Discover's filters as the page holds them; the URL query is their source of truth. */
export type JournalFilters = {
  style: string[];
  species: Species[];
  heat: HeatTreatment[];
  rind: RindTreatment[];
  agingMin: number | null;
  agingMax: number | null;
  agingBy: 'target' | 'tasted';
  minScore: number | null;
  maker: string;
  q: string;
  sort: JournalSort;
  page: number;
};

export type ListView = 'cards' | 'table';

export const DEFAULT_FILTERS: JournalFilters = {
  style: [],
  species: [],
  heat: [],
  rind: [],
  agingMin: null,
  agingMax: null,
  agingBy: 'target',
  minScore: null,
  maker: '',
  q: '',
  sort: 'newest',
  page: 1,
};

/** Delay between the last key typed in the search box and the request, ms. */
export const SEARCH_DEBOUNCE_MS = 350;

const shape = journalListQuerySchema.shape;

// Each key is read on its own, so one bad value in a shared link drops only that filter.
function read<K extends keyof typeof shape>(query: LocationQuery, key: K): unknown {
  const raw = query[key];
  const value = Array.isArray(raw) ? raw.filter(Boolean).join(',') : (raw ?? undefined);
  const parsed = shape[key].safeParse(value === '' ? undefined : value);
  return parsed.success ? parsed.data : undefined;
}

/** Reads the filters from a route query, ignoring anything that is not a valid value. */
export function filtersFromQuery(query: LocationQuery): JournalFilters {
  const list = <T>(key: 'style' | 'species' | 'heat' | 'rind') =>
    ((read(query, key) as T[] | undefined) ?? []).filter((v, i, all) => all.indexOf(v) === i);
  const num = (key: 'agingMin' | 'agingMax' | 'minScore') =>
    (read(query, key) as number | undefined) ?? null;
  return {
    style: list<string>('style'),
    species: list<Species>('species'),
    heat: list<HeatTreatment>('heat'),
    rind: list<RindTreatment>('rind'),
    agingMin: num('agingMin'),
    agingMax: num('agingMax'),
    agingBy: (read(query, 'agingBy') as 'target' | 'tasted' | undefined) ?? 'target',
    minScore: num('minScore'),
    maker: ((read(query, 'maker') as string | undefined) ?? '').replace(/^@/, ''),
    q: (read(query, 'q') as string | undefined) ?? '',
    sort: (read(query, 'sort') as JournalSort | undefined) ?? 'newest',
    page: (read(query, 'page') as number | undefined) ?? 1,
  };
}

/** The filters as API parameters, defaults left out so URLs stay short. */
export function filtersToParams(filters: JournalFilters): JournalListParams {
  const params: JournalListParams = {};
  if (filters.style.length) params.style = filters.style;
  if (filters.species.length) params.species = filters.species;
  if (filters.heat.length) params.heat = filters.heat;
  if (filters.rind.length) params.rind = filters.rind;
  if (filters.agingMin !== null) params.agingMin = filters.agingMin;
  if (filters.agingMax !== null) params.agingMax = filters.agingMax;
  // Kept even before a range is typed, so the switch does not spring back.
  if (filters.agingBy !== 'target') params.agingBy = filters.agingBy;
  if (filters.minScore !== null) params.minScore = filters.minScore;
  if (filters.maker.trim()) params.maker = filters.maker.trim().replace(/^@/, '').toLowerCase();
  if (filters.q.trim()) params.q = filters.q.trim();
  if (filters.sort !== 'newest') params.sort = filters.sort;
  if (filters.page > 1) params.page = filters.page;
  return params;
}

type Options = {
  /** The route whose query holds the filters; changes elsewhere are ignored. */
  routeName: string;
  /** Parameters always sent, e.g. { mine: true } for the member's own journals. */
  fixed?: JournalListParams;
  pageSize?: number;
};

/**
 * A filtered, paginated list of journals whose filters live in the URL query (so a view can
 * be shared), with a debounced text search and stale requests cancelled.
 */
export function useJournalList(options: Options) {
  const route = useRoute();
  const router = useRouter();
  const pageSize = options.pageSize ?? 24;

  const filters = computed(() => filtersFromQuery(route.query));
  const view = computed<ListView>(() => (route.query.view === 'table' ? 'table' : 'cards'));
  const activeCount = computed(() => {
    const f = filters.value;
    return (
      f.style.length +
      f.species.length +
      f.heat.length +
      f.rind.length +
      (f.agingMin !== null || f.agingMax !== null ? 1 : 0) +
      (f.minScore !== null ? 1 : 0) +
      (f.maker ? 1 : 0) +
      (f.q ? 1 : 0)
    );
  });

  const result = ref<JournalPage | null>(null);
  const loading = ref(false);
  const error = ref<string | null>(null);
  /** The search box's text; it reaches the URL after SEARCH_DEBOUNCE_MS of quiet. */
  const searchText = ref(filters.value.q);

  let controller: AbortController | null = null;
  let searchTimer: ReturnType<typeof setTimeout> | undefined;

  const apiParams = computed<JournalListParams>(() => ({
    ...filtersToParams(filters.value),
    ...options.fixed,
    pageSize,
  }));

  /** Loads the page for the current filters, cancelling any request still running. */
  async function load() {
    controller?.abort();
    const mine = new AbortController();
    controller = mine;
    loading.value = true;
    error.value = null;
    try {
      const page = await listJournals(apiParams.value, mine.signal);
      if (!mine.signal.aborted) result.value = page;
    } catch (e) {
      if (mine.signal.aborted || (e as Error).name === 'AbortError') return;
      error.value = e instanceof ApiError ? e.message : 'Could not load the journals.';
    } finally {
      if (controller === mine) {
        loading.value = false;
        controller = null;
      }
    }
  }

  function queryFor(next: JournalFilters, nextView: ListView = view.value): LocationQueryRaw {
    const query: LocationQueryRaw = { ...toQuery(filtersToParams(next)) };
    if (nextView === 'table') query.view = 'table';
    return query;
  }

  /** Changes some filters; any change but the page itself starts again at page 1. */
  function update(patch: Partial<JournalFilters>) {
    const next = { ...filters.value, page: 1, ...patch };
    const push = 'page' in patch && Object.keys(patch).length === 1;
    const target = { name: options.routeName, query: queryFor(next) };
    return push ? router.push(target) : router.replace(target);
  }

  /** Clears every filter (and the search box), keeping the sort and the view. */
  function resetFilters() {
    clearTimeout(searchTimer);
    searchText.value = '';
    return router.replace({
      name: options.routeName,
      query: queryFor({ ...DEFAULT_FILTERS, sort: filters.value.sort }),
    });
  }

  function setView(next: ListView) {
    return router.replace({ name: options.routeName, query: queryFor(filters.value, next) });
  }

  watch(searchText, (text) => {
    clearTimeout(searchTimer);
    if (text.trim() === filters.value.q) return;
    searchTimer = setTimeout(() => update({ q: text.trim() }), SEARCH_DEBOUNCE_MS);
  });

  // Back, forward or a pasted link: the box follows the URL.
  watch(
    () => filters.value.q,
    (q) => {
      if (q !== searchText.value.trim()) searchText.value = q;
    },
  );

  watch(
    () => (route.name === options.routeName ? JSON.stringify(apiParams.value) : null),
    (key) => {
      if (key !== null) void load();
    },
    { immediate: true },
  );

  onScopeDispose(() => {
    clearTimeout(searchTimer);
    controller?.abort();
  });

  return {
    filters,
    view,
    activeCount,
    result,
    loading,
    error,
    searchText,
    pageSize,
    update,
    resetFilters,
    setView,
    reload: load,
  };
}
