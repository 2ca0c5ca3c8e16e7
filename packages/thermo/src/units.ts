/** Convert a Celsius temperature to kelvin. */
export function celsiusToKelvin(tC: number): number {
  return tC + 273.15
}

/** Convert a kelvin temperature to Celsius. */
export function kelvinToCelsius(T: number): number {
  return T - 273.15
}
