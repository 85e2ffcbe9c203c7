'use client';

import { useState } from 'react';
import type { RecordOptions } from '@/lib/data/record';
import type { StreamTokenRow } from '@/lib/data/stream-tokens';
import { ManualGrid } from './manual-grid';
import { RunHeaderFields, type HeaderErrors, type HeaderState } from './run-header-fields';
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

function initialHeader(options: RecordOptions, user: RecordUser): HeaderState {
  const self = options.operators.find((o) => o.id === user.id) ?? options.operators[0];
  return {
    jointId: String(options.joints[0]?.id ?? ''),
    methodId: String(options.methods[0]?.id ?? ''),
    lubricantId: String(options.lubricants[0]?.id ?? ''),
    operatorId: String(self?.id ?? ''),
    cohortId: self?.cohortIds[0] ? String(self.cohortIds[0]) : '',
    recordedAt: new Date().toISOString().slice(0, 16),
    notes: '',
    hardwareSetId: '',
    lubricantLotId: '',
    gasketCondition: '',
  };
}

/** The record page: one run header, then the ways in as tabs (arrow keys move between tabs). */
export function RecordTabs({ options, tokens, recordings, user }: { options: RecordOptions; tokens: StreamTokenRow[]; recordings: Array<{ id: number; jointId: number; recordedAt: string }>; user: RecordUser }) {
  const [tab, setTab] = useState<TabKey>('upload');
  const [header, setHeader] = useState<HeaderState>(() => initialHeader(options, user));
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
        {tab === 'upload' && joint ? <UploadPanel joint={joint} header={header} rememberedMappings={options.rememberedMappings} onHeaderErrors={setErrors} units={user.units} /> : null}
        {tab === 'manual' && joint && method ? <ManualGrid key={`${joint.id}-${method.id}`} joint={joint} method={method} header={header} onHeaderErrors={setErrors} units={user.units} /> : null}
        {tab === 'simulate' ? <SimulatePanel header={header} onHeaderErrors={setErrors} /> : null}
        {tab === 'stream' && joint ? <StreamPanel joint={joint} joints={options.joints} header={header} tokens={tokens} recordings={recordings} onHeaderErrors={setErrors} canManageTokens={user.role === 'instructor'} units={user.units} /> : null}
      </div>
    </div>
  );
}
