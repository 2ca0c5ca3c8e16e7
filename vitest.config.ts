import { defineConfig } from 'vitest/config'

export default defineConfig({
  test: {
    projects: ['packages/thermo', 'packages/schemas', 'apps/api', 'apps/web'],
  },
})
