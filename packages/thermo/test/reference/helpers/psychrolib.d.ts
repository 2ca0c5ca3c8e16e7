// psychrolib ships no type declarations; only the two calls the reference tests use.
declare module 'psychrolib' {
  const psychrolib: { SI: number; SetUnitSystem(system: number): void; GetSatVapPres(tC: number): number }
  export default psychrolib
}
