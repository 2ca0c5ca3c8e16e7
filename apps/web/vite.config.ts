import vue from '@vitejs/plugin-vue'
import { defineConfig } from 'vite'

/**
 * Vendor chunks (rolldown's `output.codeSplitting.groups`; a higher priority captures a module first):
 * the framework the sign-in page needs, then libraries that only lazily loaded screens use, so they load
 * with those screens and stay cached between releases of the app's own code. PrimeVue's components are
 * left to automatic splitting: grouping them would put the data table into the first page.
 */
const VENDOR_GROUPS = [
  {
    name: 'vendor-vue',
    test: /[\\/]node_modules[\\/](\.pnpm[\\/][^\\/]+[\\/]node_modules[\\/])?(vue|@vue|vue-router|pinia)[\\/]/,
    priority: 40,
  },
  {
    name: 'vendor-prime',
    test: /[\\/]node_modules[\\/](\.pnpm[\\/][^\\/]+[\\/]node_modules[\\/])?(@primevue[\\/]core|@primeuix[\\/](themes|utils|styled))[\\/]/,
    priority: 30,
  },
  {
    name: 'vendor-charts',
    test: /[\\/]node_modules[\\/](\.pnpm[\\/][^\\/]+[\\/]node_modules[\\/])?(echarts|zrender|vue-echarts)[\\/]/,
    priority: 20,
  },
  {
    name: 'thermo',
    test: /[\\/]packages[\\/]thermo[\\/]src[\\/](?!units\.ts|errors\.ts)/,
    priority: 20,
  },
  {
    name: 'vendor-zod',
    test: /[\\/]node_modules[\\/](\.pnpm[\\/][^\\/]+[\\/]node_modules[\\/])?zod[\\/]/,
    priority: 10,
  },
]

export default defineConfig({
  plugins: [vue()],
  server: { port: 5173, proxy: { '/api': 'http://127.0.0.1:3000' } },
  build: {
    chunkSizeWarningLimit: 900,
    rolldownOptions: { output: { codeSplitting: { groups: VENDOR_GROUPS } } },
  },
})
