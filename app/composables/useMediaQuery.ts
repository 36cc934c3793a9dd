/** Whether a CSS media query matches, following changes (false before mount and in tests without matchMedia). */
export function useMediaQuery(query: string) {
  const matches = ref(false)
  if (import.meta.client && typeof window.matchMedia === 'function') {
    const mql = window.matchMedia(query)
    matches.value = mql.matches
    const onChange = (e: MediaQueryListEvent) => (matches.value = e.matches)
    mql.addEventListener('change', onChange)
    onScopeDispose(() => mql.removeEventListener('change', onChange))
  }
  return matches
}
