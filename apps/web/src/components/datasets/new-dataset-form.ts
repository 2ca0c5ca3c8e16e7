import { z } from 'zod'

/**
 * The new data set form as the person types it (pressure in their display unit).
 * Kept beside the form until issue 5 publishes its create-data-set schema in @ebullio/schemas;
 * the messages are the ones a 422 from the server would put on the same fields.
 */
export const newDatasetFormSchema = z.object({
  title: z.string().trim().min(3, 'Give the data set a title of at least 3 characters.').max(200, 'Keep the title under 200 characters.'),
  systemId: z.string().min(1, 'Choose the binary system that was measured.'),
  pressure: z.number({ error: 'Enter the nominal pressure.' }).positive('The nominal pressure must be above zero.'),
  projectRef: z.string().trim().max(100, 'Keep the project reference under 100 characters.'),
  apparatusNotes: z.string().trim().max(4000, 'Keep the notes under 4000 characters.'),
})
