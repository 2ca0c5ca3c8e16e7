import type { Db } from '../db/index.js'

export interface UploadRecord {
  id: string
  kind: 'calibration' | 'run' | 'points'
  originalName: string
  contentType: string
  sizeBytes: number
  sha256: string
  uploadedBy: string
  uploadedAt: Date
  dataSetId: string | null
}

/** Keep an uploaded file exactly as received. */
export async function insertUpload(
  db: Db,
  u: {
    kind: 'calibration' | 'run' | 'points'
    originalName: string
    contentType: string
    content: Buffer
    sha256: string
    uploadedBy: string
    dataSetId: string | null
  },
): Promise<UploadRecord> {
  const r = await db
    .insertInto('upload')
    .values({
      kind: u.kind,
      original_name: u.originalName,
      content_type: u.contentType,
      size_bytes: u.content.length,
      sha256: u.sha256,
      content: u.content,
      uploaded_by: u.uploadedBy,
      data_set_id: u.dataSetId,
    })
    .returning(['id', 'uploaded_at'])
    .executeTakeFirstOrThrow()
  return {
    id: r.id,
    kind: u.kind,
    originalName: u.originalName,
    contentType: u.contentType,
    sizeBytes: u.content.length,
    sha256: u.sha256,
    uploadedBy: u.uploadedBy,
    uploadedAt: r.uploaded_at,
    dataSetId: u.dataSetId,
  }
}

/** The stored file with its bytes. */
export async function findUploadContent(db: Db, id: string) {
  return db.selectFrom('upload').selectAll().where('id', '=', id).executeTakeFirst()
}

export async function listUploadsOf(db: Db, dataSetId: string): Promise<UploadRecord[]> {
  const rows = await db
    .selectFrom('upload')
    .select([
      'id',
      'kind',
      'original_name',
      'content_type',
      'size_bytes',
      'sha256',
      'uploaded_by',
      'uploaded_at',
      'data_set_id',
    ])
    .where('data_set_id', '=', dataSetId)
    .orderBy('uploaded_at')
    .execute()
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    originalName: r.original_name,
    contentType: r.content_type,
    sizeBytes: r.size_bytes,
    sha256: r.sha256,
    uploadedBy: r.uploaded_by,
    uploadedAt: r.uploaded_at,
    dataSetId: r.data_set_id,
  }))
}

/** Everyone who uploaded a file behind the data set's points, carried-over ones included (four-eyes rule). */
export async function uploadersOf(db: Db, dataSetId: string): Promise<string[]> {
  const rows = await db
    .selectFrom('upload')
    .select('uploaded_by')
    .distinct()
    .where((eb) =>
      eb.or([
        eb('data_set_id', '=', dataSetId),
        eb(
          'id',
          'in',
          eb
            .selectFrom('point')
            .select('upload_id')
            .where('data_set_id', '=', dataSetId)
            .where('upload_id', 'is not', null)
            .$narrowType<{ upload_id: string }>(),
        ),
      ]),
    )
    .execute()
  return rows.map((r) => r.uploaded_by)
}

/** A run file with this SHA-256 already behind the data set's points (its own uploads or carried-over ones). */
export async function findCommittedRun(
  db: Db,
  dataSetId: string,
  sha256: string,
): Promise<{ id: string; originalName: string; uploadedAt: Date } | undefined> {
  const r = await db
    .selectFrom('upload')
    .select(['id', 'original_name', 'uploaded_at'])
    .where('kind', '=', 'run')
    .where('sha256', '=', sha256)
    .where((eb) =>
      eb.or([
        eb('data_set_id', '=', dataSetId),
        eb(
          'id',
          'in',
          eb
            .selectFrom('point')
            .select('upload_id')
            .where('data_set_id', '=', dataSetId)
            .where('upload_id', 'is not', null)
            .$narrowType<{ upload_id: string }>(),
        ),
      ]),
    )
    .orderBy('uploaded_at')
    .executeTakeFirst()
  return r && { id: r.id, originalName: r.original_name, uploadedAt: r.uploaded_at }
}
