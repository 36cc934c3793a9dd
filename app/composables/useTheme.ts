import { STORAGE_KEYS } from '~/utils/storage-keys'

export type Theme = 'dark' | 'light'

const theme = ref<Theme>('dark')

function apply(t: Theme) {
  const root = document.documentElement
  root.classList.toggle('dark', t === 'dark')
  root.classList.toggle('light', t === 'light')
  document.querySelector('meta[name="theme-color"]')?.setAttribute('content', t === 'dark' ? '#14161a' : '#f6f4f0')
}

/** Dark by default (readable in a dim room); the choice is kept on the device. */
export function useTheme() {
  function init() {
    const urlTheme = new URLSearchParams(location.search).get('theme')
    const stored = localStorage.getItem(STORAGE_KEYS.theme)
    const pick = urlTheme ?? stored
    theme.value = pick === 'light' ? 'light' : 'dark'
    if (urlTheme) localStorage.setItem(STORAGE_KEYS.theme, theme.value)
    apply(theme.value)
  }
  function set(t: Theme) {
    theme.value = t
    localStorage.setItem(STORAGE_KEYS.theme, t)
    apply(t)
  }
  return { theme: readonly(theme), init, set }
}
