/** Comment threads on a data set or pinned to a point; replies notify the thread's author. */
import { webLink } from '@ebullio/schemas'
import type { Kysely } from 'kysely'
import type { SessionUser } from '../auth/index.js'
import type { Config } from '../config.js'
import type { Database } from '../db/index.js'
import { AppError, conflict, notFound } from '../errors/index.js'
import { notifyUser } from '../mail/outbox.js'
import { appendAudit } from '../repositories/audit.repository.js'
import * as repo from '../repositories/comments.repository.js'
import { findDataSet } from '../repositories/datasets.repository.js'
import { findPoint } from '../repositories/points.repository.js'
import { visibleOrNotFound } from './lab-access.js'

export interface CommentInput {
  body: string
  pointId?: string | null
  parentId?: string | null
}

/** Start a thread (on the data set or a point) or reply to one. Replies go to the root of the thread. */
export async function addComment(
  db: Kysely<Database>,
  config: Config,
  user: SessionUser,
  dataSetId: string,
  input: CommentInput,
) {
  return db.transaction().execute(async (tx) => {
    const d = visibleOrNotFound(user, await findDataSet(tx, dataSetId))
    let pointId = input.pointId ?? null
    let parentId: string | null = null
    let parent: Awaited<ReturnType<typeof repo.findComment>> | undefined
    if (input.parentId) {
      parent = await repo.findComment(tx, input.parentId)
      if (!parent || parent.data_set_id !== dataSetId) throw notFound('There is no such comment in this data set.')
      parentId = parent.parent_id ?? parent.id
      pointId = parent.point_id
    } else if (pointId) {
      const p = await findPoint(tx, pointId)
      if (!p || p.dataSetId !== dataSetId) throw notFound('There is no such point in this data set.')
    }
    const id = await repo.insertComment(tx, {
      dataSetId,
      pointId,
      parentId,
      authorId: user.id,
      body: input.body.trim(),
    })
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'comment',
      entityId: id,
      action: parentId ? 'reply' : 'comment',
      dataSetId,
      after: { pointId, parentId, body: input.body.trim().slice(0, 200) },
    })
    if (parentId) {
      const root = parentId === parent!.id ? parent! : await repo.findComment(tx, parentId)
      const notify = new Set([root!.author_id, parent!.author_id])
      notify.delete(user.id)
      for (const authorId of notify) {
        await notifyUser(tx, authorId, {
          subject: `Ebullio: ${user.displayName} replied to your comment on "${d.title}"`,
          text: `${user.displayName} replied:\n\n${input.body.trim()}\n\n${webLink(config.publicUrl, 'dataset', { id: dataSetId })}\n`,
        })
      }
    }
    return { id, parentId, pointId }
  })
}

/** Resolve or reopen a thread (its root comment). */
export async function setThreadResolved(
  db: Kysely<Database>,
  user: SessionUser,
  dataSetId: string,
  commentId: string,
  resolved: boolean,
) {
  return db.transaction().execute(async (tx) => {
    const d = visibleOrNotFound(user, await findDataSet(tx, dataSetId))
    const c = await repo.findComment(tx, commentId)
    if (!c || c.data_set_id !== dataSetId) throw notFound('There is no such comment in this data set.')
    if (c.parent_id) throw conflict('Resolve the thread from its first comment, not from a reply.')
    // The data set's author cannot close a reviewer's objection alone: only the thread's author or a lead
    // chemist who is not the data set's author may; otherwise the approver gives an override reason when signing.
    const independentLead = user.roles.includes('lead_chemist') && d.createdBy !== user.id
    if (resolved && c.author_id !== user.id && !independentLead) {
      throw new AppError(
        403,
        'resolve_refused',
        'Only the author of this thread or a lead chemist who did not create the data set may resolve it; the approver can otherwise sign with an override reason.',
      )
    }
    await repo.setResolved(tx, commentId, resolved, user.id)
    await appendAudit(tx, {
      actorId: user.id,
      entity: 'comment',
      entityId: commentId,
      action: resolved ? 'resolve thread' : 'reopen thread',
      dataSetId,
      before: { resolved: c.resolved },
      after: { resolved },
    })
    return { id: commentId, resolved }
  })
}

/** A page of the open threads a person takes part in, answered by the repository as it is. */
export { listOpenThreadsOf } from '../repositories/comments.repository.js'
