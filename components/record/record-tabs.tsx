'use client';

import { startTransition, useState } from 'react';
import { saveRecordPreferencesAction } from '@/app/(lab)/record/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import type { RecordPreferences } from '@/lib/record/record-preferences';
import type { RecordOptions } from '@/lib/data/record';
import type { StreamTokenRow } from '@/lib/data/stream-tokens';
import { ManualGrid } from './manual-grid';
import { defaultCohortId, RunHeaderFields, type HeaderErrors, type HeaderState } from './run-header-fields';
import { SimulatePanel } from './simulate-panel';
import { StreamPanel } from './stream-panel';
import { UploadPanel } from './upload-panel';

const TABS = [
  { key: 'upload', label: 'Upload a file' },
  { key: 'manual', label: 'Enter by hand' },
  { key: 'stream', label: 'Stream live' },
  { key: 'simulate', label: 'Simulate' },
] as const;
type TabKey = (typeof TABS)[number]['key'];

export interface RecordUser {
  id: number;
  role: string;
  units: 'si' | 'us';
}

function initialHeader(options: RecordOptions, user: RecordUser, remembered: RecordPreferences['header']): HeaderState {
  const pick = <T extends { id: number }>(items: T[], id: number | null | undefined) => items.find((item) => item.id === id) ?? items[0];
  const operator = options.operators.find((o) => o.id === remembered?.operatorId) ?? options.operators.find((o) => o.id === user.id) ?? options.operators[0];
  return {
    jointId: String(pick(options.joints, remembered?.jointId)?.id ?? ''),
    methodId: String(pick(options.methods, remembered?.methodId)?.id ?? ''),
    lubricantId: String(pick(options.lubricants, remembered?.lubricantId)?.id ?? ''),
    operatorId: String(operator?.id ?? ''),
    cohortId: defaultCohortId(options, operator),
    recordedAt: new Date().toISOString().slice(0, 16),
    notes: '',
    hardwareSetId: '',
    lubricantLotId: '',
    gasketCondition: '',
  };
}

/** Stores the way in and the header's choices for this person (Record opens with them next time). */
function remember(wayIn: TabKey, header: HeaderState) {
  const data = new FormData();
  const id = (text: string) => (text === '' ? null : Number(text));
  data.set('payload', JSON.stringify({ wayIn, header: { jointId: id(header.jointId), methodId: id(header.methodId), lubricantId: id(header.lubricantId), operatorId: id(header.operatorId) } }));
  startTransition(async () => {
    await saveRecordPreferencesAction(IDLE_FORM_STATE, data);
  });
}

const REMEMBERED_KEYS = ['jointId', 'methodId', 'lubricantId', 'operatorId'] as const;

/** The record page: one run header, then the ways in as tabs (arrow keys move between tabs). */
export function RecordTabs({ options, tokens, recordings, user, preferences = {} }: {
  options: RecordOptions; tokens: StreamTokenRow[]; recordings: Array<{ id: number; jointId: number; recordedAt: string }>; user: RecordUser; preferences?: RecordPreferences;
}) {
  const [tab, setTabState] = useState<TabKey>(preferences.wayIn ?? 'upload');
  const [header, setHeaderState] = useState<HeaderState>(() => initialHeader(options, user, preferences.header));
  const setTab = (next: TabKey) => {
    if (next !== tab) remember(next, header);
    setTabState(next);
  };
  const setHeader = (next: HeaderState) => {
    if (REMEMBERED_KEYS.some((key) => next[key] !== header[key])) remember(tab, next);
    setHeaderState(next);
  };
  const [errors, setErrors] = useState<HeaderErrors>({});
  const joint = options.joints.find((j) => String(j.id) === header.jointId) ?? null;
  const method = options.methods.find((m) => String(m.id) === header.methodId) ?? null;

  if (!options.joints.length || !options.methods.length || !options.lubricants.length) {
    return (
      <p className="rounded-card border border-dashed border-rule bg-panel p-6 text-sm">
        There is nothing to record on yet: an instructor or admin first adds a joint, a method and a lubricant on the Joints page.
      </p>
    );
  }

  function onTabKey(e: React.KeyboardEvent, index: number) {
    if (e.key !== 'ArrowRight' && e.key !== 'ArrowLeft') return;
    const next = TABS[(index + (e.key === 'ArrowRight' ? 1 : TABS.length - 1)) % TABS.length]!;
    setTab(next.key);
    document.getElementById(`record-tab-${next.key}`)?.focus();
  }

  return (
    <div className="space-y-4">
      <RunHeaderFields options={options} value={header} onChange={(h) => { setHeader(h); setErrors({}); }} errors={errors} />
      <div role="tablist" aria-label="Ways in" className="flex flex-wrap gap-1 border-b border-rule">
        {TABS.map((t, i) => (
          <button key={t.key} id={`record-tab-${t.key}`} role="tab" type="button" aria-selected={tab === t.key} aria-controls={`record-panel-${t.key}`} tabIndex={tab === t.key ? 0 : -1}
            onClick={() => setTab(t.key)} onKeyDown={(e) => onTabKey(e, i)}
            className={`-mb-px rounded-t-md border px-4 py-2 text-sm font-medium ${tab === t.key ? 'border-rule border-b-panel bg-panel text-ink' : 'border-transparent text-muted hover:text-ink'}`}>
            {t.label}
          </button>
        ))}
      </div>
      <div id={`record-panel-${tab}`} role="tabpanel" aria-labelledby={`record-tab-${tab}`} className="rounded-card border border-rule bg-panel p-4">
        {tab === 'upload' && joint ? <UploadPanel joint={joint} method={method} header={header} rememberedMappings={options.rememberedMappings} onHeaderErrors={setErrors} units={user.units} /> : null}
        {tab === 'manual' && joint && method ? <ManualGrid key={`${joint.id}-${method.id}`} joint={joint} method={method} header={header} onHeaderErrors={setErrors} units={user.units} /> : null}
        {tab === 'simulate' ? <SimulatePanel header={header} onHeaderErrors={setErrors} /> : null}
        {tab === 'stream' && joint ? <StreamPanel joint={joint} joints={options.joints} header={header} tokens={tokens} recordings={recordings} onHeaderErrors={setErrors} canManageTokens={user.role === 'instructor'} units={user.units} /> : null}
      </div>
    </div>
  );
}
