/** The engine's one seeded generator (src/random.ts) under the name the reference tests have used. */
export { seededRandom as prng } from '../../../src/random.js'
