import type { StyleDto } from '@shared/types/style';
import { ref } from 'vue';
import { fetchStyles } from '../api/styles';

let cache: Promise<StyleDto[]> | null = null;

/** The reference cheese styles, fetched once per page load; returns refs for the list and error. */
export function useStyles() {
  const styles = ref<StyleDto[]>([]);
  const error = ref<string | null>(null);
  const loading = ref(true);
  cache ??= fetchStyles().catch((e: unknown) => {
    cache = null;
    throw e;
  });
  cache
    .then((list) => (styles.value = list))
    .catch(
      (e: unknown) => (error.value = e instanceof Error ? e.message : 'Could not load the styles.'),
    )
    .finally(() => (loading.value = false));
  return { styles, error, loading };
}
