export * from './auth.js'
export * from './design.js'
