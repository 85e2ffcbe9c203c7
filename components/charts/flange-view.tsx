'use client';

import { useState } from 'react';
import type { UnitSystem } from '@/lib/calc/units';
import { deviationColour } from '@/lib/charts/palette';
import { readStud } from '@/lib/charts/stud-reading';
import { DeviationLegend } from './deviation-legend';

export interface FlangeViewProps {
  /** Every stud's load (index 0 = position 1): the final loads, or the loads at the replay step. */
  loadsN: number[];
  targetN: number;
  bandPercent: number;
  units: UnitSystem;
  /** The stud (or the studs a tensioner step pulls together) being tightened now (1-based), outlined in the accent colour. */
  activePosition?: number | readonly number[];
  /** Drawn size in px (the SVG is square); e.g. 640 for the classroom projector. Default 320. */
  size?: number;
  label: string;
  /** Draw the deviation legend under the flange (default true); the classroom shows one shared legend. */
  showLegend?: boolean;
}

const VIEW = 200;
const CENTRE = VIEW / 2;
const PITCH_RADIUS = 72;

/**
 * Centre of stud `position` (1-based) of `count` on the pitch circle: position 1 at 12 o'clock,
 * numbered clockwise (SVG y grows downwards, so a growing angle turns clockwise on screen).
 */
export function studCentre(position: number, count: number, radius = PITCH_RADIUS): { x: number; y: number } {
  const angle = -Math.PI / 2 + (2 * Math.PI * (position - 1)) / count;
  return { x: CENTRE + radius * Math.cos(angle), y: CENTRE + radius * Math.sin(angle) };
}

/**
 * The flange seen face-on: a ring with the studs on their pitch circle, each filled by its
 * deviation from target, numbered, focusable, with its reading on hover and focus.
 */
export function FlangeView({ loadsN, targetN, bandPercent, units, activePosition, size = 320, label, showLegend = true }: FlangeViewProps) {
  const [shown, setShown] = useState<number | null>(null);
  const count = loadsN.length;
  const readings = loadsN.map((n, i) => readStud(i + 1, n, targetN, units));
  const studRadius = Math.min(13, ((Math.PI * PITCH_RADIUS) / Math.max(count, 1)) * 0.62);
  const large = size >= 480;
  const shownReading = shown !== null ? readings[shown - 1] : undefined;
  const shownCentre = shown !== null ? studCentre(shown, count) : undefined;

  return (
    <div className="inline-flex flex-col items-center gap-3 text-ink">
      <div className="relative" style={{ width: size, height: size }}>
        <svg
          role="group"
          aria-label={label}
          width={size}
          height={size}
          viewBox={`0 0 ${VIEW} ${VIEW}`}
          className="block overflow-visible"
        >
          <circle cx={CENTRE} cy={CENTRE} r={(PITCH_RADIUS + 22 + PITCH_RADIUS - 26) / 2} fill="none"
            style={{ stroke: 'var(--el-panel)', strokeWidth: 48 }} />
          <circle cx={CENTRE} cy={CENTRE} r={PITCH_RADIUS + 22} fill="none" style={{ stroke: 'var(--el-rule)', strokeWidth: 1 }} />
          <circle cx={CENTRE} cy={CENTRE} r={PITCH_RADIUS - 26} fill="none" style={{ stroke: 'var(--el-rule)', strokeWidth: 1 }} />
          {readings.map((r) => {
            const { x, y } = studCentre(r.position, count);
            const active = typeof activePosition === 'number' ? r.position === activePosition : (activePosition?.includes(r.position) ?? false);
            const open = shown === r.position;
            return (
              <g
                key={r.position}
                role="img"
                tabIndex={0}
                aria-label={r.sentence}
                data-position={r.position}
                className="cursor-default outline-none"
                onFocus={() => setShown(r.position)}
                onBlur={() => setShown((s) => (s === r.position ? null : s))}
                onMouseEnter={() => setShown(r.position)}
                onMouseLeave={() => setShown((s) => (s === r.position ? null : s))}
                onKeyDown={(e) => {
                  if (e.key === 'Escape') setShown(null);
                }}
              >
                <title>{r.sentence}</title>
                {(active || open) && (
                  <circle
                    cx={x}
                    cy={y}
                    r={studRadius + 4}
                    fill="none"
                    data-testid={active ? 'active-ring' : 'focus-ring'}
                    style={{ stroke: active ? 'var(--el-accent)' : 'currentColor', strokeWidth: active ? 3 : 1.5 }}
                  />
                )}
                <circle
                  cx={x}
                  cy={y}
                  r={studRadius}
                  data-testid="stud"
                  style={{ fill: deviationColour(r.deviationPercent, bandPercent), stroke: 'currentColor', strokeWidth: 1 }}
                />
                <text
                  x={x}
                  y={y}
                  textAnchor="middle"
                  dominantBaseline="central"
                  className="num"
                  style={{
                    fill: 'currentColor',
                    fontSize: Math.max(7, studRadius * 0.95),
                    fontWeight: 600,
                    paintOrder: 'stroke',
                    stroke: 'var(--el-panel)',
                    strokeWidth: 2.5,
                  }}
                  aria-hidden="true"
                >
                  {r.position}
                </text>
              </g>
            );
          })}
        </svg>
        {shownReading && shownCentre && (
          <div
            role="tooltip"
            className={`num pointer-events-none absolute z-10 w-max max-w-[16rem] -translate-x-1/2 -translate-y-1/2 rounded-card border border-rule bg-panel px-3 py-2 shadow-sm ${large ? 'text-xl' : 'text-sm'}`}
            style={{ left: '50%', top: '50%' }}
          >
            <div className="font-semibold">Stud {shownReading.position}</div>
            <div>{shownReading.loadText}</div>
            <div className="text-muted">
              {shownReading.percentOfTargetText} of target · {shownReading.deviationText}
            </div>
          </div>
        )}
      </div>
      {showLegend ? <DeviationLegend bandPercent={bandPercent} large={large} /> : null}
    </div>
  );
}
