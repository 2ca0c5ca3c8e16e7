import { dataSetSchema } from '@ebullio/schemas'
import { z } from 'zod'

/**
 * The new data set form as the person types it: the API's own schema (@ebullio/schemas `dataSetSchema`,
 * same messages as a 422), except that the pressure is typed in the chosen unit and converted to Pa on
 * submit, and the system picker gets a message that says what to do.
 */
export const newDatasetFormSchema = dataSetSchema
  .omit({ nominalPressurePa: true, nominalTemperatureK: true, systemId: true })
  .extend({
    systemId: z.string().min(1, 'Choose the binary system that was measured.'),
    /** isobaric data: the nominal pressure in the chosen unit (checked on submit with the kind of data) */
    pressure: z.number().positive('The nominal pressure must be above zero.').nullable(),
    /** isothermal data: the temperature in the chosen unit */
    temperature: z.number().nullable(),
  })
