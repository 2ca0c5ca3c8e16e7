import { defineConfig, mergeConfig } from 'vitest/config'
import base from './vitest.config'

// The mutation run (stryker.config.mjs) instruments the code, which makes the slow cases several times slower.
export default mergeConfig(base, defineConfig({ test: { testTimeout: 60_000 } }))
