import { fileURLToPath } from 'node:url'
import { defineConfig } from 'vitest/config'
import { defineVitestProject } from '@nuxt/test-utils/config'

// The app's own aliases, for the projects that run outside Nuxt (app/utils import `#shared/...` and `~/...`).
const resolve = { alias: { '#shared': fileURLToPath(new URL('./shared', import.meta.url)), '~': fileURLToPath(new URL('./app', import.meta.url)) } }

export default defineConfig({
  test: {
    projects: [
      { resolve, test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' } },
      await defineVitestProject({
        test: { name: 'nuxt', include: ['tests/nuxt/**/*.test.ts'], environment: 'nuxt', setupFiles: ['tests/nuxt/setup.ts'] },
      }),
      { resolve, test: { name: 'api', include: ['tests/api/**/*.test.ts'], environment: 'node', testTimeout: 30_000, hookTimeout: 60_000 } },
      // Browser tests run after the others, so load from the API suites cannot starve them.
      { resolve, test: { name: 'e2e', include: ['tests/e2e/**/*.test.ts'], environment: 'node', testTimeout: 60_000, hookTimeout: 60_000, fileParallelism: false, sequence: { groupOrder: 1 } } },
    ],
  },
})
