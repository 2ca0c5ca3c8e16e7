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
