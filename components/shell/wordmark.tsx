/** Evenload's mark: eight studs on a ring, evenly loaded, beside the name. */
export function Wordmark({ size = 28 }: { size?: number }) {
  const studs = Array.from({ length: 8 }, (_, index) => {
    const angle = (index / 8) * 2 * Math.PI - Math.PI / 2;
    return { x: 16 + 11 * Math.cos(angle), y: 16 + 11 * Math.sin(angle) };
  });
  return (
    <span className="inline-flex items-center gap-2 font-semibold tracking-tight">
      <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true">
        <circle cx="16" cy="16" r="11" fill="none" stroke="currentColor" strokeOpacity="0.35" strokeWidth="4" />
        {studs.map((stud, index) => (
          <circle key={index} cx={stud.x} cy={stud.y} r="2.6" className="fill-accent" />
        ))}
      </svg>
      <span>Evenload</span>
    </span>
  );
}
