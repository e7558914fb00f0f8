import { fileURLToPath } from 'node:url'
import { defineVitestProject } from '@nuxt/test-utils/config'
import { defineConfig } from 'vitest/config'

const root = fileURLToPath(new URL('.', import.meta.url))
const alias = { '#shared': `${root}shared`, '~~': root.replace(/\/$/, '') }

export default defineConfig({
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: 'unit', environment: 'node', include: ['tests/unit/**/*.spec.ts'], testTimeout: 60_000 }
      },
      // Components and stores in a Nuxt runtime (happy-dom); API calls answered by registerEndpoint.
      await defineVitestProject({
        test: {
          name: 'nuxt',
          include: ['tests/nuxt/**/*.spec.ts'],
          environment: 'nuxt',
          environmentOptions: { nuxt: { domEnvironment: 'happy-dom' } },
          testTimeout: 60_000
        }
      }),
      {
        resolve: { alias },
        test: {
          name: 'api',
          environment: 'node',
          include: ['tests/api/**/*.spec.ts'],
          globalSetup: ['tests/support/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false
        }
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          environment: 'node',
          include: ['tests/e2e/**/*.spec.ts'],
          globalSetup: ['tests/support/global-setup.ts'],
          testTimeout: 90_000,
          hookTimeout: 120_000,
          fileParallelism: false
        }
      }
    ]
  }
})
