import { describe, expect, it } from 'vitest'
import { WEB_PATHS, webLink, webPath } from './web-paths.js'

describe('webPath / webLink', () => {
  it('fills parameters, URI-encoded, under the public URL', () => {
    expect(webPath('dataset', { id: 'a1' })).toBe('/datasets/a1')
    expect(webLink('https://lab.example/', 'resetPassword', { token: 'x/y z' })).toBe(
      'https://lab.example/reset-password/x%2Fy%20z',
    )
    expect(webLink('http://127.0.0.1:3000', 'datasets', {})).toBe('http://127.0.0.1:3000/datasets')
  })

  it('refuses a missing parameter instead of mailing a broken link', () => {
    expect(() => webPath('dataset', { id: '' })).toThrow('webPath(dataset): parameter "id" is missing')
  })

  it('has no two pages on the same path', () => {
    const paths = Object.values(WEB_PATHS)
    expect(new Set(paths).size).toBe(paths.length)
  })
})
