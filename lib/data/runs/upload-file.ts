import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { UploadChunk, sequelize } from '@/models';
import { BYTES_PER_MB } from '@/lib/ingest/text-file';

/** Bytes per row of `upload_chunks`: well under MariaDB's default max_allowed_packet (16 MB). */
export const UPLOAD_CHUNK_BYTES = BYTES_PER_MB;

/**
 * Writes an uploaded file's bytes as 1 MB chunks, each a bound binary parameter of its own
 * INSERT, inside the caller's transaction.
 */
export async function storeUploadBytes(uploadId: number, bytes: Uint8Array, transaction: Transaction): Promise<void> {
  for (let index = 0, offset = 0; offset < bytes.length || index === 0; index++, offset += UPLOAD_CHUNK_BYTES) {
    const piece = Buffer.from(bytes.buffer, bytes.byteOffset + offset, Math.min(UPLOAD_CHUNK_BYTES, bytes.length - offset));
    await UploadChunk.create({ uploadId, chunkIndex: index, bytes: piece }, { transaction });
  }
}

/** The stored file of an upload, its chunks put back together in order (exports, recompute). */
export async function readUploadBytes(uploadId: number, transaction?: Transaction): Promise<Buffer> {
  const rows = await sequelize.query<{ bytes: Buffer }>('SELECT bytes FROM upload_chunks WHERE upload_id = ? ORDER BY chunk_index', { type: QueryTypes.SELECT, transaction, replacements: [uploadId] });
  return Buffer.concat(rows.map((row) => Buffer.from(row.bytes)));
}
