import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Uploaded files in 1 MB chunks (`upload_chunks`), so a file up to the 20 MB limit is stored
 * without any single statement passing MariaDB's max_allowed_packet (16 MB by default). Existing
 * files move over as one chunk each (copied inside the server, no packet involved), then
 * `uploads.content` goes. `down` puts the bytes back into `uploads.content`; a file over
 * max_allowed_packet cannot go back (the reason for this change) and stops the rollback.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('upload_chunks', {
    upload_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'uploads', key: 'id' }, onDelete: 'CASCADE' },
    chunk_index: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
    bytes: { type: DataTypes.BLOB('medium'), allowNull: false },
  });
  await qi.sequelize.query('INSERT INTO upload_chunks (upload_id, chunk_index, bytes) SELECT id, 0, content FROM uploads');
  await qi.removeColumn('uploads', 'content');
};

export const down: Migration = async ({ context: qi }) => {
  await qi.addColumn('uploads', 'content', { type: DataTypes.BLOB('long'), allowNull: true });
  const chunks = await qi.sequelize.query<{ upload_id: number; chunk_index: number }>('SELECT upload_id, chunk_index FROM upload_chunks ORDER BY upload_id, chunk_index', { type: QueryTypes.SELECT });
  for (const chunk of chunks) {
    await qi.sequelize.query(
      "UPDATE uploads u JOIN upload_chunks c ON c.upload_id = u.id AND c.chunk_index = ? SET u.content = CONCAT(COALESCE(u.content, ''), c.bytes) WHERE u.id = ?",
      { replacements: [chunk.chunk_index, chunk.upload_id] },
    );
  }
  const [lost] = await qi.sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM uploads WHERE content IS NULL', { type: QueryTypes.SELECT });
  if (Number(lost?.n ?? 0) > 0) throw new Error(`${lost!.n} uploaded file(s) are too large for uploads.content (max_allowed_packet); remove them before rolling back`);
  await qi.changeColumn('uploads', 'content', { type: DataTypes.BLOB('long'), allowNull: false });
  await qi.dropTable('upload_chunks');
};
