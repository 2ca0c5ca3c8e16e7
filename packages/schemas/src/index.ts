export * from './auth.js'
