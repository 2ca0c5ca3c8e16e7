/**
 * The web app's page paths, in one table: apps/web/src/router builds its routes from it and the API builds every
 * link it mails from it (`webLink`), so a mailed link cannot point at a page that does not exist.
 */
export const WEB_PATHS = {
  home: '/',
  datasets: '/datasets',
  datasetNew: '/datasets/new',
  dataset: '/datasets/:id',
  approvals: '/approvals',
  threads: '/threads',
  catalogue: '/systems',
  system: '/systems/:id',
  labSystem: '/lab/systems/:id',
  adminPeople: '/admin/people',
  adminComponents: '/admin/components',
  adminGcMethods: '/admin/gc-methods',
  adminMail: '/admin/mail',
  adminOutbox: '/admin/undelivered-mail',
  instrumentChecks: '/checks',
  account: '/account',
  forbidden: '/forbidden',
  verifyReport: '/verify/:id',
  signIn: '/sign-in',
  forgotPassword: '/forgot-password',
  resetPassword: '/reset-password/:token',
  welcome: '/welcome/:token',
} as const

export type WebPage = keyof typeof WEB_PATHS

/** The names of a path's `:parameters`, as a type: `'/datasets/:id'` → `'id'`. */
type ParamsOf<P extends string> = P extends `${string}:${infer Name}/${infer Rest}`
  ? Name | ParamsOf<`/${Rest}`>
  : P extends `${string}:${infer Name}`
    ? Name
    : never

export type WebPathParams<K extends WebPage> = Record<ParamsOf<(typeof WEB_PATHS)[K]>, string>

/** The path of a page with its parameters filled in (URI-encoded); a missing parameter throws. */
export function webPath<K extends WebPage>(page: K, params: WebPathParams<K>): string {
  return WEB_PATHS[page].replace(/:(\w+)/g, (_m, name: string) => {
    const v = (params as Record<string, string | undefined>)[name]
    if (v === undefined || v === '') throw new Error(`webPath(${page}): parameter "${name}" is missing`)
    return encodeURIComponent(v)
  })
}

/** An absolute link for mail: the server's public URL (no trailing slash) followed by the page's path. */
export function webLink<K extends WebPage>(publicUrl: string, page: K, params: WebPathParams<K>): string {
  return `${publicUrl.replace(/\/+$/, '')}${webPath(page, params)}`
}
