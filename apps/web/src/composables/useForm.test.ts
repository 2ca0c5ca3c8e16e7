/** useForm: messages on the field they belong to, nested fields included, from zod and from the server's 422. */
import { describe, expect, it } from 'vitest'
import { z } from 'zod'
import { ApiError } from '../api/client'
import { useForm } from './useForm'

const schema = z.object({
  title: z.string().min(1, 'Enter a title'),
  citation: z.object({
    authors: z.string().min(1, 'Name the authors'),
    year: z.number().int().min(1800, 'A year from 1800 on'),
  }),
})
const blank = () => ({ title: '', citation: { authors: '', year: 1700 } })

describe('useForm', () => {
  it('keeps every nested field error under its dotted path, beside the flat ones', () => {
    const f = useForm(schema, blank())
    expect(f.validate()).toBeNull()
    expect(f.errors.value).toEqual({
      title: 'Enter a title',
      'citation.authors': 'Name the authors',
      'citation.year': 'A year from 1800 on',
    })
  })

  it('answers the parsed data and no errors once the values are right', () => {
    const f = useForm(schema, blank())
    f.validate()
    Object.assign(f.values, { title: 'Run 4', citation: { authors: 'Ng, Ortiz', year: 1998 } })
    expect(f.validate()).toEqual({ title: 'Run 4', citation: { authors: 'Ng, Ortiz', year: 1998 } })
    expect(f.errors.value).toEqual({})
  })

  it('does not run the action while a field is wrong', async () => {
    const f = useForm(schema, blank())
    let ran = false
    expect(await f.submit(async () => void (ran = true))).toBe(false)
    expect(ran).toBe(false)
  })

  it("puts a 422's details on their fields, nested ones by their full path, and no form-level message", async () => {
    const f = useForm(schema, { title: 'Run 4', citation: { authors: 'Ng', year: 1998 } })
    const refused = new ApiError(422, 'validation', 'Check the marked fields.', [
      { path: 'title', message: 'A data set with this title exists' },
      { path: 'citation.year', message: 'The year is after the publication date' },
    ])
    const ok = await f.submit(async () => {
      throw refused
    })
    expect(ok).toBe(false)
    expect(f.errors.value).toEqual({
      title: 'A data set with this title exists',
      'citation.year': 'The year is after the publication date',
    })
    expect(f.formError.value).toBeNull()
    expect(f.busy.value).toBe(false)
  })

  it('shows a refusal without field details as the form message, and anything else as a generic one', async () => {
    const f = useForm(schema, { title: 'Run 4', citation: { authors: 'Ng', year: 1998 } })
    await f.submit(async () => {
      throw new ApiError(409, 'stale_write', 'Someone changed this data set; reload it.')
    })
    expect(f.formError.value).toBe('Someone changed this data set; reload it.')
    await f.submit(async () => {
      throw new TypeError('x is undefined')
    })
    expect(f.formError.value).toBe('Something went wrong. Try again.')
  })
})
