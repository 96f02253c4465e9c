/** One point of a score trajectory: weeks since the start of care and the score. */
export type SparkPoint = { weeks: number; value: number };

type Props = {
  points: SparkPoint[];
  /** The instrument's range, so lines of different episodes are drawn on the same scale. */
  min: number;
  max: number;
  /** Names the line for screen readers, e.g. "First-step pain (0–10)". */
  label: string;
  width?: number;
  height?: number;
};

const PAD = 4;

/**
 * A small, dependency-free line of scores over weeks in care (no chart library, so it can sit in
 * any screen). Screen readers get a sentence with every value instead of the drawing.
 */
export function Sparkline({ points, min, max, label, width = 160, height = 40 }: Props) {
  const sorted = [...points].sort((a, b) => a.weeks - b.weeks);
  const summary = sorted.length
    ? `${label}: ${sorted.map((p) => `week ${p.weeks}: ${p.value}`).join(', ')}`
    : `${label}: no scores yet`;
  if (sorted.length === 0) {
    return (
      <span role="img" aria-label={summary} className="text-xs text-ink-faint">
        no scores yet
      </span>
    );
  }
  const lastWeek = Math.max(1, sorted[sorted.length - 1]?.weeks ?? 1);
  const span = max - min || 1;
  const x = (w: number) => PAD + (w / lastWeek) * (width - 2 * PAD);
  // Screen y grows downwards: the top of the box is the instrument's maximum.
  const y = (v: number) => PAD + (1 - (Math.min(max, Math.max(min, v)) - min) / span) * (height - 2 * PAD);
  const path = sorted.map((p, i) => `${i === 0 ? 'M' : 'L'}${x(p.weeks).toFixed(1)},${y(p.value).toFixed(1)}`).join(' ');
  return (
    <svg role="img" aria-label={summary} width={width} height={height} viewBox={`0 0 ${width} ${height}`} className="overflow-visible">
      <line x1={PAD} x2={width - PAD} y1={height - PAD} y2={height - PAD} className="stroke-line" strokeWidth={1} />
      <path d={path} fill="none" className="stroke-accent" strokeWidth={1.75} strokeLinejoin="round" strokeLinecap="round" />
      {sorted.map((p) => (
        <circle key={`${p.weeks}-${p.value}`} cx={x(p.weeks)} cy={y(p.value)} r={2.5} className="fill-accent-strong" />
      ))}
    </svg>
  );
}
