export default defineNuxtPlugin(() => {
  useTheme().init()
})
