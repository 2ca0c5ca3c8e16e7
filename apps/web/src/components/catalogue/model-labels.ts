/** Display names of activity models as chemists write them. */
export const MODEL_LABELS: Record<string, string> = {
  ideal: 'Ideal (Raoult)',
  margules: 'Margules',
  'van-laar': 'Van Laar',
  wilson: 'Wilson',
  nrtl: 'NRTL',
  uniquac: 'UNIQUAC',
}

/** Units of activity-model parameters as Ebullio stores them (energies in J/mol; Margules and Van Laar dimensionless). */
export const PARAMETER_UNITS: Record<string, string> = { a12: 'J/mol', a21: 'J/mol', b12: 'J/mol', b21: 'J/mol', A12: '', A21: '', alpha: '' }

/** "b12 = 2094 J/mol, alpha = 0.5081" */
export function parameterText(ps: { name: string; value: number }[]): string {
  return ps.map((p) => `${p.name} = ${p.value.toPrecision(4)}${PARAMETER_UNITS[p.name] ? ' ' + PARAMETER_UNITS[p.name] : ''}`).join(', ')
}
