/** The one error type the engine throws: `code` for programs, `message` for a chemist. */
export class ThermoError extends Error {
  readonly code: string
  readonly details?: unknown
  constructor(code: string, message: string, details?: unknown) {
    super(message)
    this.name = 'ThermoError'
    this.code = code
    this.details = details
  }
}

/** Input checks shared by every public function, so the same mistake always reads the same way. */

/** Throw unless `x` is a mole fraction in [0, 1]; `name` is e.g. 'x1' or 'y1', `kind` 'Liquid' or 'Vapour'. */
export function checkMoleFraction(x: number, name: string): void {
  const kind = name.startsWith('y') ? 'Vapour' : 'Liquid'
  if (!Number.isFinite(x) || x < 0 || x > 1) {
    throw new ThermoError('invalid-input', `${kind} mole fraction ${name} must be between 0 and 1; got ${x}.`)
  }
}

/** Throw unless T is a positive, finite temperature in kelvin. */
export function checkTemperature(T: number, name = 'Temperature'): void {
  if (!Number.isFinite(T) || T <= 0) {
    throw new ThermoError('invalid-input', `${name} must be a positive number of kelvins; got ${T}.`)
  }
}

/** Throw unless P is a positive, finite pressure in pascals. */
export function checkPressure(P: number, name = 'Pressure'): void {
  if (!Number.isFinite(P) || P <= 0) {
    throw new ThermoError('invalid-input', `${name} must be a positive number of pascals; got ${P}.`)
  }
}
