/** The one place the web app talks to the server. Every failure becomes an ApiError with the server's message. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: unknown = null,
  ) {
    super(message)
  }
  /** Field → message, for inline form validation from a 422 answer. */
  fieldErrors(): Record<string, string> {
    const out: Record<string, string> = {}
    if (Array.isArray(this.details))
      for (const d of this.details as { path: string; message: string }[]) out[d.path] ??= d.message
    return out
  }
}

type Listener = (e: ApiError) => void
const listeners = new Set<Listener>()
/** Subscribe to failed requests (the app shows them as toasts). */
export function onApiError(fn: Listener): () => void {
  listeners.add(fn)
  return () => listeners.delete(fn)
}

const unauthorized = new Set<() => void>()
/** Subscribe to 401 answers (the session ended); the router sends the person to the sign-in page. */
export function onUnauthorized(fn: () => void): () => void {
  unauthorized.add(fn)
  return () => unauthorized.delete(fn)
}

export interface RequestOptions {
  /** Do not announce the error globally (the caller shows it inline). */
  quiet?: boolean
  signal?: AbortSignal
}

async function request<T>(method: string, url: string, body?: unknown, opts: RequestOptions = {}): Promise<T> {
  const isForm = body instanceof FormData
  let res: Response
  try {
    res = await fetch(url, {
      method,
      credentials: 'same-origin',
      headers:
        body === undefined || isForm
          ? { Accept: 'application/json' }
          : { 'Content-Type': 'application/json', Accept: 'application/json' },
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
      signal: opts.signal,
    })
  } catch {
    const err = new ApiError(0, 'network', 'The server cannot be reached. Check your connection and try again.')
    if (!opts.quiet) listeners.forEach((l) => l(err))
    throw err
  }
  if (res.status === 204) return undefined as T
  const type = res.headers.get('content-type') ?? ''
  const data = type.includes('application/json') ? await res.json() : await res.text()
  if (!res.ok) {
    const e = (data as { error?: { code: string; message: string; details: unknown } })?.error
    const err = new ApiError(
      res.status,
      e?.code ?? 'http_' + res.status,
      e?.message ?? `The server answered ${res.status}.`,
      e?.details ?? null,
    )
    if (res.status === 401) unauthorized.forEach((l) => l())
    else if (!opts.quiet) listeners.forEach((l) => l(err))
    throw err
  }
  return data as T
}

export const api = {
  get: <T>(url: string, opts?: RequestOptions) => request<T>('GET', url, undefined, opts),
  post: <T>(url: string, body?: unknown, opts?: RequestOptions) => request<T>('POST', url, body ?? {}, opts),
  put: <T>(url: string, body?: unknown, opts?: RequestOptions) => request<T>('PUT', url, body ?? {}, opts),
  patch: <T>(url: string, body?: unknown, opts?: RequestOptions) => request<T>('PATCH', url, body ?? {}, opts),
  del: <T>(url: string, opts?: RequestOptions) => request<T>('DELETE', url, undefined, opts),
}

/** Build a query string from defined values only. */
export function query(params: Record<string, string | number | boolean | undefined | null>): string {
  const q = new URLSearchParams()
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null && v !== '') q.set(k, String(v))
  const s = q.toString()
  return s ? `?${s}` : ''
}
