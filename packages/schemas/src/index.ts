export * from './auth.js'
export * from './design.js'
export * from './lab-admin.js'
export * from './lab.js'
