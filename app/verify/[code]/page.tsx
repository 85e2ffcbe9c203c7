import type { Metadata } from 'next';
import { headers } from 'next/headers';
import { AuthCard } from '@/components/auth/auth-card';
import { clientAddress } from '@/lib/auth/auth-options';
import { verifyTrainingRecord } from '@/lib/data/qualification/verify-record';
import { formatDate } from '@/lib/format/format-date';
import { RECORD_STATUS_LABEL } from '@/lib/qualification/training-record';
import { formatVerificationCode } from '@/lib/qualification/verification-code';

export const metadata: Metadata = { title: 'Check a record of training', robots: { index: false } };
export const dynamic = 'force-dynamic';

const STATUS_STYLE = { valid: 'text-good', expired: 'text-caution', revoked: 'text-danger', replaced: 'text-danger' } as const;

/** Public: anyone with a record's code sees who, which course and scope, the dates and whether it stands; nothing else. */
export default async function VerifyRecordPage({ params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  const answer = await verifyTrainingRecord(decodeURIComponent(code).slice(0, 40), clientAddress(Object.fromEntries(await headers())));
  const footer = <>Records of training are issued by the training centre through Evenload.</>;
  if (answer.kind === 'rate_limited') {
    return <AuthCard title="Check a record of training" footer={footer}><p className="mt-4 text-sm" role="alert">Too many checks from your address. Wait 15 minutes, then try again.</p></AuthCard>;
  }
  if (answer.kind === 'unknown') {
    return <AuthCard title="Check a record of training" footer={footer}><p className="mt-4 text-sm" role="status">No record with this code.</p></AuthCard>;
  }
  const { record } = answer;
  const rows: Array<[string, string]> = [
    ['Name', record.traineeName],
    ['Course', record.courseName],
    ['Scope', record.scope],
    ['Date issued', formatDate(record.issuedOn)],
    ['Valid until', formatDate(record.validUntil)],
  ];
  return (
    <AuthCard title="Record of training" lead={`Code ${formatVerificationCode(decodeURIComponent(code).toUpperCase())}`} footer={footer}>
      <p className={`mt-4 text-lg font-semibold ${STATUS_STYLE[record.status]}`} data-testid="record-status">Status: {RECORD_STATUS_LABEL[record.status]}</p>
      <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        {rows.map(([label, value]) => (
          <div key={label} className="contents">
            <dt className="text-muted">{label}</dt>
            <dd>{value}</dd>
          </div>
        ))}
      </dl>
    </AuthCard>
  );
}
