import type { Role } from '@ebullio/schemas'
import 'vue-router'

declare module 'vue-router' {
  interface RouteMeta {
    /** Page title shown in the browser tab. */
    title?: string
    /** Reachable without signing in. */
    public?: boolean
    /** Holders of any of these roles may open the page; absent = any signed-in user. */
    roles?: Role[]
    /** Show in the side navigation under this group. */
    nav?: {
      group: 'Laboratory' | 'Review' | 'Design' | 'Administration' | 'You'
      label: string
      icon: string
      order: number
      /** One line under the label on the overview page (every entry has one). */
      hint: string
      devOnly?: boolean
    }
  }
}
