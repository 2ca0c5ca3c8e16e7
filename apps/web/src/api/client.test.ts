/**
 * The API client against a stubbed fetch: the error shape every caller relies on, who hears about failures (toasts,
 * the 401 hook), and how writes are sent (same-origin credentials, JSON that a cross-site form cannot forge).
 */
import { afterEach, describe, expect, it, vi } from 'vitest'
import { api, ApiError, onApiError, onUnauthorized, query } from './client'

function answer(status: number, body?: unknown) {
  const f = vi.fn(async () => (body === undefined ? new Response(null, { status }) : Response.json(body, { status })))
  vi.stubGlobal('fetch', f)
  return f
}
afterEach(() => vi.unstubAllGlobals())

describe('api client', () => {
  it('turns an error answer into an ApiError with status, code, message and details', async () => {
    answer(422, {
      error: { code: 'validation', message: 'Check the fields.', details: [{ path: 'title', message: 'Too long' }] },
    })
    const e = (await api.post('/api/data-sets', { title: 'x' }).catch((x) => x)) as ApiError
    expect(e).toBeInstanceOf(ApiError)
    expect([e.status, e.code, e.message]).toEqual([422, 'validation', 'Check the fields.'])
    expect(e.fieldErrors()).toEqual({ title: 'Too long' })
  })

  it('names the status when the server sends no error body, and the network when there is no answer', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response('Bad gateway', { status: 502, headers: { 'content-type': 'text/plain' } })),
    )
    await expect(api.get('/api/x')).rejects.toMatchObject({
      status: 502,
      code: 'http_502',
      message: 'The server answered 502.',
    })
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    )
    await expect(api.get('/api/x')).rejects.toMatchObject({ status: 0, code: 'network' })
  })

  it('announces failures to the app unless the caller shows them itself; a 401 goes to the session hook instead', async () => {
    const heard: string[] = []
    const expired: number[] = []
    const off = onApiError((e) => heard.push(e.code))
    const off401 = onUnauthorized(() => expired.push(1))
    answer(403, { error: { code: 'forbidden', message: 'No.' } })
    await api.get('/api/a').catch(() => null)
    await api.get('/api/a', { quiet: true }).catch(() => null)
    answer(401, { error: { code: 'unauthenticated', message: 'Sign in.' } })
    await api.get('/api/b').catch(() => null)
    await api.get('/api/b', { quiet: true }).catch(() => null)
    off()
    off401()
    expect(heard).toEqual(['forbidden'])
    expect(expired).toEqual([1, 1])
  })

  it('sends writes as JSON with same-origin credentials to a path on this origin', async () => {
    const f = answer(200, { ok: true })
    await api.patch('/api/data-sets/d1', { title: 'Run 4' })
    const [url, init] = f.mock.calls[0] as unknown as [string, RequestInit]
    expect(url).toBe('/api/data-sets/d1')
    expect(init.method).toBe('PATCH')
    expect(init.credentials).toBe('same-origin')
    // application/json cannot be sent by a cross-site HTML form, and the server also checks Origin on writes
    expect((init.headers as Record<string, string>)['Content-Type']).toBe('application/json')
    expect(init.body).toBe('{"title":"Run 4"}')
  })

  it('sends a post without a body as an empty JSON object, and answers nothing for 204', async () => {
    const f = answer(204)
    expect(await api.post('/api/auth/sign-out')).toBeUndefined()
    const init = (f.mock.calls[0] as unknown as [string, RequestInit])[1]
    expect(init.body).toBe('{}')
  })

  it('builds query strings from set values only', () => {
    expect(query({ q: 'a b', page: 2, state: undefined, empty: '', none: null, own: false })).toBe(
      '?q=a+b&page=2&own=false',
    )
    expect(query({})).toBe('')
  })
})
