import type { Metadata } from 'next';
import Link from 'next/link';
import { z } from 'zod';
import { CriteriaForm } from '@/components/cohorts/criteria-form';
import { InviteForm } from '@/components/cohorts/invite-form';
import { AwaitingVerdicts, MembersList, SignedOff, type ListPages } from '@/components/cohorts/cohort-lists';
import { CRITERIA_LIMITS } from '@/lib/assessment/criteria';
import { cohortDetail } from '@/lib/data/cohorts';
import { orNotFound } from '@/lib/data/page-guards';
import { formatDate } from '@/lib/format/format-date';
import { requirePageUser } from '@/lib/auth/session';

export const metadata: Metadata = { title: 'Cohort' };
export const dynamic = 'force-dynamic';

const pageParam = z.coerce.number().int().min(1).max(100_000).optional().catch(undefined);
const listPagesSchema = z.object({ awaiting: pageParam, signed: pageParam, members: pageParam });

export default async function CohortPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePageUser(['instructor', 'admin']);
  const { id } = await params;
  const cohort = await orNotFound(() => cohortDetail(user, Number(id)));
  const pages: ListPages = listPagesSchema.parse(await searchParams);
  // A page link changes one list's page and keeps the others (each list opens where it is paged).
  const hrefFor = (param: string, page: number) => {
    const next = new URLSearchParams(Object.entries(pages).filter(([, v]) => v !== undefined).map(([k, v]) => [k, String(v)]));
    next.set(param, String(page));
    return `/cohorts/${cohort.id}?${next.toString()}#${param}`;
  };
  const lists = { cohort, pages, hrefFor };
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <p className="text-sm text-muted"><Link href="/cohorts" className="underline underline-offset-4">Cohorts</Link></p>
          <h1 className="text-2xl font-semibold">{cohort.name}</h1>
          <p className="text-sm text-muted">{cohort.site} · {formatDate(cohort.startsOn)} – {formatDate(cohort.endsOn)} · instructor {cohort.instructorName}</p>
        </div>
        <Link href={`/cohorts/${cohort.id}/sheet`} className="ml-auto rounded-md border border-rule px-3 py-1.5 text-sm hover:bg-rule/60">Cohort summary sheet</Link>
      </div>

      <div className="grid gap-4 lg:grid-cols-2">
        <section aria-labelledby="invite-heading" className="rounded-card border border-rule bg-panel p-4">
          <h2 id="invite-heading" className="mb-2 font-semibold">Invite trainees</h2>
          <InviteForm cohortId={cohort.id} />
        </section>
        <section aria-labelledby="criteria-heading" className="rounded-card border border-rule bg-panel p-4">
          <h2 id="criteria-heading" className="font-semibold">Acceptance criteria</h2>
          <p className="mb-2 text-xs text-muted">{cohort.criteria.isDefault ? 'The defaults apply until you save your own.' : 'Saved for this cohort.'} Signed-off results keep the criteria they were judged with.</p>
          <CriteriaForm cohortId={cohort.id} criteria={cohort.criteria} limits={CRITERIA_LIMITS} />
        </section>
      </div>

      <MembersList {...lists} />
      <AwaitingVerdicts {...lists} />
      <SignedOff {...lists} />
    </div>
  );
}
