'use client';

import { useEffect, useState } from 'react';
import type { RecordJoint } from '@/lib/data/record';
import { channelFieldsText, DELIMITER_WORDS } from '@/lib/joints/logger-line-input';
import { CopyButton } from '../ui/copy-button';

/**
 * The bridge path, step by step, for browsers that cannot connect a logger themselves: the bridge
 * script on the computer next to the logger reads lines in the joint's own layout and units and
 * posts them to this run.
 */
export function BridgeInstructions({ runId, joint }: { runId: number; joint: RecordJoint }) {
  const [origin, setOrigin] = useState('');
  useEffect(() => setOrigin(window.location.origin), []);
  const f = joint.loggerLine;
  const command = `npx tsx scripts/stream-bridge.ts --url ${origin} --run ${runId} --token <token> --file lines.txt`;
  return (
    <ol className="list-decimal space-y-1 pl-5 text-sm" aria-label="Stream through the bridge" data-testid="bridge-steps">
      <li>Get a bridge token for {joint.name}: an instructor creates one under Bridge tokens on this page and copies it with its Copy button.</li>
      <li>On the computer the logger is plugged into, install Node.js 20 or later and open a terminal in a copy of Evenload.</li>
      <li>
        Let the logger write its lines as set on the joint: fields separated by {DELIMITER_WORDS[f.delimiter]}, decimal {f.decimalComma ? 'comma' : 'point'}, time in
        seconds in field {f.timeField}, channels 1 to {f.channelFields?.length ?? joint.studCount} in {f.channelFields ? `fields ${channelFieldsText(f.channelFields)}` : 'the fields after it'}, loads
        in {f.loadUnit}. Save them to a file, or give the serial device (for example /dev/ttyUSB0) as the file.
      </li>
      <li>
        Run this, with the token in place of &lt;token&gt;:
        <span className="mt-1 flex flex-wrap items-center gap-2">
          <code className="break-all rounded bg-paper px-2 py-1 text-xs" data-testid="bridge-command">{command}</code>
          <CopyButton text={command} label="Copy command" />
        </span>
      </li>
      <li>The readings appear here as they arrive. Press Finish when the last pass is done.</li>
    </ol>
  );
}
