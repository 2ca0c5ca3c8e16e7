import { dataSetSchema } from '@ebullio/schemas'
import { z } from 'zod'

/**
 * The metadata of a draft or returned version as the person edits it: the API's own rules and messages
 * (@ebullio/schemas `dataSetSchema`), with the pressure typed in the chosen unit (converted to Pa on save).
 */
export const metadataFormSchema = dataSetSchema.pick({ title: true, apparatusNotes: true, projectRef: true }).extend({
  pressure: z.number({ error: 'Enter the nominal pressure.' }).positive('The nominal pressure must be above zero.'),
})
