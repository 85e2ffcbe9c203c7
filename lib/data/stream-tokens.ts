import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { AppError } from '@/lib/http/errors';
import { Joint, StreamToken, sequelize } from '@/models';
import type { SessionUser } from '../auth/session';

export interface StreamTokenRow {
  id: number;
  jointId: number;
  jointName: string;
  label: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

const sha256 = (token: string) => createHash('sha256').update(token).digest('hex');

/** Tokens this instructor created (newest first). Other roles have none. */
export async function listStreamTokens(user: SessionUser): Promise<StreamTokenRow[]> {
  if (user.role !== 'instructor') return [];
  const rows = await sequelize.query<{ id: number; joint_id: number; joint_name: string; label: string; created_at: Date; last_used_at: Date | null; revoked_at: Date | null }>(
    `SELECT t.id, t.joint_id, j.name AS joint_name, t.label, t.created_at, t.last_used_at, t.revoked_at
     FROM stream_tokens t JOIN joints j ON j.id = t.joint_id WHERE t.created_by_id = ? ORDER BY t.id DESC`,
    { type: QueryTypes.SELECT, replacements: [user.id] },
  );
  return rows.map((r) => ({
    id: Number(r.id),
    jointId: Number(r.joint_id),
    jointName: r.joint_name,
    label: r.label,
    createdAt: new Date(r.created_at).toISOString(),
    lastUsedAt: r.last_used_at ? new Date(r.last_used_at).toISOString() : null,
    revokedAt: r.revoked_at ? new Date(r.revoked_at).toISOString() : null,
  }));
}

/**
 * Creates a bridge token for one joint. Only instructors. The token is returned once; only its
 * sha256 is stored, so it cannot be shown again.
 */
export async function createStreamToken(user: SessionUser, jointId: number, label: string): Promise<{ id: number; token: string }> {
  if (user.role !== 'instructor') throw new AppError('forbidden', 'Only instructors create bridge tokens.');
  const joint = await Joint.findByPk(jointId);
  if (!joint) throw new AppError('invalid_input', 'That joint does not exist. Choose one from the list.', { field: 'jointId', fieldErrors: { jointId: ['Choose a joint.'] } });
  const token = `evl_${randomBytes(24).toString('base64url')}`;
  const { id } = await StreamToken.create({ jointId: joint.id, tokenSha256: sha256(token), label, createdById: user.id });
  return { id, token };
}

/** Revokes a token this instructor created. @throws AppError('not_found') for another's token. */
export async function revokeStreamToken(user: SessionUser, tokenId: number): Promise<void> {
  const [affected] = await StreamToken.update({ revokedAt: new Date() }, { where: { id: tokenId, createdById: user.id, revokedAt: null } });
  if (affected === 0) {
    const rows = await sequelize.query('SELECT 1 FROM stream_tokens WHERE id = ? AND created_by_id = ?', { type: QueryTypes.SELECT, replacements: [tokenId, user.id] });
    if (!rows.length) throw new AppError('not_found', 'That token does not exist or is not yours.');
  }
}

/**
 * The joint a bearer token streams for. Tokens are not sessions: this is the only check on
 * POST /api/runs/:id/stream besides the run's joint and status.
 *
 * @throws AppError('unauthenticated') with no token or an unknown one; AppError('forbidden') for a revoked one.
 */
export async function authenticateStreamToken(authorization: string | null): Promise<{ tokenId: number; jointId: number }> {
  const match = /^Bearer\s+(\S+)\s*$/i.exec(authorization ?? '');
  if (!match) throw new AppError('unauthenticated', 'Send the bridge token as "Authorization: Bearer <token>". An instructor creates one on the Record page, under Stream live.');
  const rows = await sequelize.query<{ id: number; joint_id: number; revoked_at: Date | null }>('SELECT id, joint_id, revoked_at FROM stream_tokens WHERE token_sha256 = ?', {
    type: QueryTypes.SELECT,
    replacements: [sha256(match[1]!)],
  });
  const row = rows[0];
  if (!row) throw new AppError('unauthenticated', 'The bridge token is not known. Check it was copied whole, or create a new one on the Record page.');
  if (row.revoked_at) throw new AppError('forbidden', 'The bridge token was revoked. Create a new one on the Record page, under Stream live.');
  await StreamToken.update({ lastUsedAt: new Date() }, { where: { id: row.id } });
  return { tokenId: Number(row.id), jointId: Number(row.joint_id) };
}
