import { positionPoint } from '@/lib/joints/joint-input';

/**
 * A small flange drawing: one circle per stud, numbered clockwise from 1 at the top
 * (docs/REFERENCE.md §6 ✓ [KNM]). Server-safe (no hooks). `highlight` marks positions, e.g. repeated ones.
 */
export function FlangeDiagram({ studCount, highlight = [], size = 180 }: { studCount: number; highlight?: readonly number[]; size?: number }) {
  if (!Number.isInteger(studCount) || studCount < 1 || studCount > 96) return null;
  const c = size / 2;
  const bolt = c - 18;
  const studR = Math.max(5, Math.min(11, (Math.PI * bolt) / studCount - 2));
  const marked = new Set(highlight);
  return (
    <svg
      viewBox={`0 0 ${size} ${size}`}
      width={size}
      height={size}
      role="img"
      aria-label={`Flange with ${studCount} studs, numbered clockwise from 1 at the top`}
      className="shrink-0"
    >
      <circle cx={c} cy={c} r={c - 4} className="fill-panel stroke-rule" strokeWidth={2} />
      <circle cx={c} cy={c} r={c * 0.42} className="fill-paper stroke-rule" strokeWidth={2} />
      <path d={`M ${c} ${c * 0.5} l -5 8 h 10 z`} className="fill-muted" aria-hidden="true" />
      {Array.from({ length: studCount }, (_, i) => {
        const p = i + 1;
        const { x, y } = positionPoint(p, studCount, bolt, c, c);
        const on = marked.has(p);
        return (
          <g key={p}>
            <circle cx={x} cy={y} r={studR} className={on ? 'fill-caution stroke-caution' : 'fill-paper stroke-ink'} strokeWidth={1.5} />
            <text
              x={x}
              y={y}
              textAnchor="middle"
              dominantBaseline="central"
              fontSize={studCount > 24 ? 7 : 9}
              className={`num ${on ? 'fill-paper' : 'fill-ink'}`}
            >
              {p}
            </text>
          </g>
        );
      })}
    </svg>
  );
}
