import { defineConfig } from 'vitest/config'
export default defineConfig({ test: { name: 'thermo', include: ['src/**/*.test.ts', 'test/**/*.test.ts'] } })
