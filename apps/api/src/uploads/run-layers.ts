/**
 * Two-layer (heterogeneous) samples of the run sheet: the analyst saw the liquid in the still split into two
 * layers. `layers` = 2 marks the sample; its `liquid` injections still give the overall composition, and the
 * separated layers, when analysed, come as phases `upper` and `lower` (both or neither).
 */
import type { Cells, Draft, RunPhase } from './run-file.js'
import { uploadError, type UploadProblem } from './problems.js'

/** A phase as a sentence names it. */
export const PHASE_WORDS: Record<RunPhase, string> = {
  liquid: 'liquid',
  vapour: 'vapour',
  upper: 'upper layer',
  lower: 'lower layer',
}

/** Read the optional `layers` cell of a row into the sample; a repeat must agree. */
export function readLayers(cell: Cells, line: number, s: Draft, problems: UploadProblem[]): void {
  const raw = cell('layers')
  if (raw === '') return
  if (raw !== '1' && raw !== '2') {
    problems.push(
      uploadError(line, 'layers', raw, 'Layers must be 1 or 2 (the number of liquid layers seen in the still).'),
    )
    return
  }
  const value = raw === '2' ? 2 : 1
  if (s.layers && s.layers.value !== value) {
    problems.push(
      uploadError(line, 'layers', raw, `Sample ${s.label} has ${s.layers.value} layers on line ${s.layers.line}.`),
    )
  } else if (!s.layers) {
    s.layers = { value, raw, line }
  }
}

/** The layer rules of one gathered sample; false when an error keeps it from becoming a point. */
export function checkLayers(s: Draft, problems: UploadProblem[]): boolean {
  const layerRows = [...s.phaseRows.upper, ...s.phaseRows.lower].sort((a, b) => a - b)
  if (s.layers?.value !== 2) {
    if (layerRows.length === 0) return true
    problems.push(
      uploadError(
        layerRows[0],
        'phase',
        s.phaseRows.upper.includes(layerRows[0]) ? 'upper' : 'lower',
        `Sample ${s.label} has layer injections but is not marked as two-layered; put 2 in layers.`,
      ),
    )
    return false
  }
  const [have, missing] = s.upper.length > 0 ? ['upper', 'lower'] : ['lower', 'upper']
  if (s.upper.length > 0 !== s.lower.length > 0) {
    problems.push(
      uploadError(
        layerRows[0] ?? s.layers.line,
        'phase',
        have,
        `Sample ${s.label}: the ${have} layer was analysed but not the ${missing} one; give both layers or neither.`,
      ),
    )
    return false
  }
  return true
}
