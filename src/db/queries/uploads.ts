import { and, desc, eq, getTableColumns } from 'drizzle-orm';
import type { Db } from '../client';
import { uploads, type Upload } from '../schema';

export async function getUpload(db: Db, id: string): Promise<Upload | undefined> {
  const rows = await db.select().from(uploads).where(eq(uploads.id, id)).limit(1);
  return rows[0];
}

/** An upload's row without its content (for lists). */
export type UploadListing = Omit<Upload, 'content'>;

/** Files that belong to one item (a spec, a library version), newest first; contents are not read. */
export async function uploadsFor(db: Db, relatedType: string, relatedId: string): Promise<UploadListing[]> {
  const { content: _content, ...listing } = getTableColumns(uploads);
  return db.select(listing).from(uploads).where(and(eq(uploads.relatedType, relatedType), eq(uploads.relatedId, relatedId))).orderBy(desc(uploads.createdAt));
}
