// useRuntimeConfig(event) makes each request its own copy of the config: a deep clone and a scan
// of the environment for every key, which measured as about half of the server's time on a plain
// request. Nothing here changes the config per request, so every request reads the one made at
// start (frozen: a library that wrote to it would throw rather than leak into other requests).
export default defineNitroPlugin((nitro) => {
  nitro.hooks.hook('request', (event) => {
    event.context.nitro ??= { errors: [] }
    event.context.nitro.runtimeConfig ??= useRuntimeConfig()
  })
})
