// Node 20 lacks Object.groupBy (Node 21+), which the Nuxt ESLint config's helpers call.
if (typeof Object.groupBy !== 'function') {
  Object.groupBy = (items, key) => {
    const out = Object.create(null)
    let i = 0
    for (const item of items) {
      const k = key(item, i++)
      ;(out[k] ??= []).push(item)
    }
    return out
  }
}
