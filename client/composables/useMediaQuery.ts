import { onScopeDispose, ref } from 'vue';

/** Whether a CSS media query matches, kept up to date (e.g. '(max-width: 860px)'). */
export function useMediaQuery(query: string) {
  const list = typeof window !== 'undefined' ? window.matchMedia(query) : null;
  const matches = ref(list?.matches ?? false);
  const onChange = (event: MediaQueryListEvent) => (matches.value = event.matches);
  list?.addEventListener('change', onChange);
  onScopeDispose(() => list?.removeEventListener('change', onChange));
  return matches;
}
