import { z } from 'zod'

// zod probes `new Function` when it builds an object schema; under the app's CSP (no 'unsafe-eval')
// that probe is reported as a violation even though zod catches it. Set at module load, before the
// schemas are built; the plain parser is quick enough here.
z.config({ jitless: true })

export default defineNuxtPlugin({ name: 'zod-jitless', enforce: 'pre', setup() {} })
