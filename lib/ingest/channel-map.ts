/**
 * A joint's channel map: which logger channel is wired to which stud position. Channels are named
 * as the logger writes them (`CH3`, `AI2`, `Channel 3`, or a gauge's serial name such as
 * `SG-1041`); numbered channels are one channel whatever the spelling (CH3 = Channel 3 = AI2,
 * because analogue inputs count from 0). Without an entry, channel k is position k (AI0 is
 * position 1). Browser-safe.
 */
import { z } from 'zod';
import { channelOfHeader, foldHeader } from './header-words';

/** Zod schema of a stored channel map (at most 200 entries; each channel once, each position once). */
export const channelMapSchema = z
  .array(z.object({ channel: z.string().trim().min(1).max(60), position: z.number().int().min(1).max(500) }))
  .max(200)
  .superRefine((entries, ctx) => {
    const keys = new Set<string>();
    const positions = new Set<number>();
    entries.forEach((e, i) => {
      const key = channelKey(e.channel);
      if (keys.has(key)) ctx.addIssue({ code: 'custom', path: [i, 'channel'], message: `Channel ${e.channel} is listed twice.` });
      if (positions.has(e.position)) ctx.addIssue({ code: 'custom', path: [i, 'position'], message: `Position ${e.position} is given to two channels.` });
      keys.add(key);
      positions.add(e.position);
    });
  });

/** A joint's channel map. */
export type ChannelMap = z.output<typeof channelMapSchema>;

/**
 * The one key of a channel: `n:3` for CH3, Channel 3 and AI2 (analogue inputs are zero-based);
 * the folded name without a unit suffix for a gauge name (`sg-1041`).
 *
 * @param zeroBasedAi whether AI/AIN numbers count from 0 (true unless the file shows otherwise).
 */
export function channelKey(name: string, zeroBasedAi = true): string {
  const ch = channelOfHeader(name);
  if (ch) return `n:${ch.analogueInput && zeroBasedAi ? ch.number + 1 : ch.number}`;
  return foldHeader(name).replace(/\s*[[(][^\])]*[\])]\s*$/, '').replace(/[_\s]+(?:kn|n|lbf|kip|ue|µε)$/u, '').trim();
}

/**
 * The stud position of a channel through the map; a numbered channel without an entry is its own
 * number (channel k → position k); a gauge name without an entry is null.
 */
export function positionOfChannel(name: string, map: ChannelMap | undefined, zeroBasedAi = true): number | null {
  const key = channelKey(name, zeroBasedAi);
  const entry = map?.find((e) => channelKey(e.channel) === key);
  if (entry) return entry.position;
  return key.startsWith('n:') ? Number(key.slice(2)) : null;
}
