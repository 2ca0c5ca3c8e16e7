import { describe, expect, it } from 'vitest'
import { sortFromTable } from './people-list'

describe('sortFromTable', () => {
  it('maps the Name and E-mail columns to the server sort and direction', () => {
    expect(sortFromTable('displayName', 1)).toEqual({ sort: 'name', order: 'asc' })
    expect(sortFromTable('email', -1)).toEqual({ sort: 'email', order: 'desc' })
  })
  it('falls back to name ascending when the sort is switched off or the column is unknown', () => {
    expect(sortFromTable('email', 0)).toEqual({ sort: 'name', order: 'asc' })
    expect(sortFromTable('roles', 1)).toEqual({ sort: 'name', order: 'asc' })
    expect(sortFromTable(undefined, null)).toEqual({ sort: 'name', order: 'asc' })
  })
})
