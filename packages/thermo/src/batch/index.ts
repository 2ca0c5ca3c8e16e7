export * from './batch-types.js'
export { simpleBatchDistillation, type SimpleBatchOptions, type SimpleBatchResult } from './simple-batch.js'
export {
  batchRectification,
  type BatchRectificationFrame,
  type BatchRectificationOptions,
  type BatchRectificationResult,
} from './rectification.js'
