import 'server-only';
import { CapturedMail } from '@/models';

export interface CapturedMailRow {
  id: number;
  to: string;
  subject: string;
  text: string;
  receivedAt: string;
}

/**
 * The mail the local SMTP fake captured, newest first. Development and demo only: the outbox page
 * answers 404 in production unless EVENLOAD_OUTBOX=1 (see lib/env.ts outboxEnabled), which is why
 * this one reader takes no signed-in user — the invited visitor has no account yet.
 */
export async function listCapturedMail(limit = 50): Promise<CapturedMailRow[]> {
  const rows = await CapturedMail.findAll({ order: [['id', 'DESC']], limit });
  return rows.map((m) => ({ id: m.id, to: m.envelopeTo, subject: m.subject ?? '(no subject)', text: m.textBody ?? '', receivedAt: m.receivedAt.toISOString() }));
}
