import { dataSetSchema } from '@ebullio/schemas'
import { z } from 'zod'

/**
 * The metadata of a draft or returned version as the person edits it: the API's own rules and messages
 * (@ebullio/schemas `dataSetSchema`), with the pressure typed in the chosen unit (converted to Pa on save).
 */
export const metadataFormSchema = dataSetSchema.pick({ title: true, apparatusNotes: true, projectRef: true }).extend({
  /** isobaric data: the nominal pressure in the chosen unit; isothermal data: the temperature (checked on save) */
  pressure: z.number().positive('The nominal pressure must be above zero.').nullable(),
  temperature: z.number().nullable(),
})
