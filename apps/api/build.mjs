// Production build of the API: one ES module, apps/api/dist/server.js, started with plain `node`.
// The workspace packages (@ebullio/thermo, @ebullio/schemas: TypeScript sources) and their own dependencies are
// bundled in; the API's npm dependencies stay external and load from apps/api/node_modules (argon2 is native).
import { build } from 'esbuild'
import path from 'node:path'
import { fileURLToPath } from 'node:url'

const here = path.dirname(fileURLToPath(import.meta.url))
const packagesDir = path.resolve(here, '../../packages') + path.sep

const externals = {
  name: 'api-dependencies-external',
  setup(b) {
    b.onResolve({ filter: /^[^./]/ }, (args) => {
      if (args.path.startsWith('@ebullio/')) return undefined
      if (args.path.startsWith('node:')) return { external: true }
      // imports made by the bundled workspace packages are bundled too (they are not the API's dependencies)
      if (args.importer.startsWith(packagesDir) || args.importer.includes(`${path.sep}.pnpm${path.sep}`))
        return undefined
      return { external: true }
    })
  },
}

const started = Date.now()
await build({
  entryPoints: [path.join(here, 'src/server.ts')],
  outfile: path.join(here, 'dist/server.js'),
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  sourcemap: true,
  logLevel: 'warning',
  plugins: [externals],
  // bundled CommonJS code may call require(): give the ES module one
  banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" },
})
console.log(`built apps/api/dist/server.js in ${Date.now() - started} ms`)
