/** Limits of the ways in, shared by the record page and the server. */
import { BYTES_PER_MB } from '@/lib/ingest/text-file';

/** Largest logger file accepted by POST /api/uploads: 20 MB (1 MB = 1,048,576 bytes). */
export const UPLOAD_LIMIT_BYTES = 20 * BYTES_PER_MB;
/** Multipart overhead allowed on top of the file (header and mapping fields). */
export const UPLOAD_FORM_OVERHEAD_BYTES = 256 * 1024;
/** Largest body of one POST /api/runs/:id/stream: 2 MB. */
export const STREAM_BODY_LIMIT_BYTES = 2 * BYTES_PER_MB;
/** Most readings in one stream request. */
export const STREAM_MAX_READINGS = 20_000;
