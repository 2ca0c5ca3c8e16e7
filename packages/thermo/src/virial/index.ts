export * from './virial-types.js'
export * from './tsonopoulos.js'
export * from './gamma-phi.js'
export * from './correction-size.js'
