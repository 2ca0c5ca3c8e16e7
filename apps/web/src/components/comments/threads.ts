import type { CommentItem } from '../../api/comments'

/** A root comment with its replies in time order. */
export interface Thread {
  root: CommentItem
  replies: CommentItem[]
}

/** Group a data set's flat comment list into threads, open ones first, newest first within each group. */
export function toThreads(comments: CommentItem[]): Thread[] {
  const roots = comments.filter((c) => !c.parentId)
  const threads = roots.map((root) => ({ root, replies: comments.filter((c) => c.parentId === root.id) }))
  return threads.sort(
    (a, b) => Number(a.root.resolved) - Number(b.root.resolved) || b.root.createdAt.localeCompare(a.root.createdAt),
  )
}

/** Open threads per point id (for the points table and the plot). */
export function openCountByPoint(comments: CommentItem[]): Map<string, number> {
  const m = new Map<string, number>()
  for (const c of comments) if (!c.parentId && !c.resolved && c.pointId) m.set(c.pointId, (m.get(c.pointId) ?? 0) + 1)
  return m
}

/** "12 Mar, 14:05". */
export const when = (iso: string) =>
  new Date(iso).toLocaleString(undefined, { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' })
