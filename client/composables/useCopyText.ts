import { onScopeDispose, ref } from 'vue';

/**
 * Copies text with the Clipboard API. `copied` is true for a moment afterwards; `failed`
 * says the browser refused (plain http, an old browser), so the view can point at the text.
 */
export function useCopyText() {
  const copied = ref(false);
  const failed = ref(false);
  let timer: ReturnType<typeof setTimeout> | undefined;

  /** Copies the text; resolves true when it reached the clipboard. */
  async function copy(text: string): Promise<boolean> {
    failed.value = false;
    try {
      if (!navigator.clipboard) throw new Error('no clipboard');
      await navigator.clipboard.writeText(text);
      copied.value = true;
      clearTimeout(timer);
      timer = setTimeout(() => (copied.value = false), 2500);
      return true;
    } catch {
      failed.value = true;
      return false;
    }
  }

  onScopeDispose(() => clearTimeout(timer));
  return { copy, copied, failed };
}
