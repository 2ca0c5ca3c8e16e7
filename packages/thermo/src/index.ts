export * from './types.js'
export * from './errors.js'
export * from './units.js'
export * from './gc/index.js'
