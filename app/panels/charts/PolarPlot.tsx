/**
 * A polar gain plot in SVG. Radius is gain in dB relative to the plot's peak, on a linear-in-dB scale
 * down to RANGE_DB below it; rings are labelled in dBi so the absolute figure is readable too.
 *  - "elevation": a half circle, horizon left and right, zenith up (angles 0..180° from one horizon).
 *  - "azimuth": a full circle, north up, bearings clockwise.
 */
interface Props {
  kind: "elevation" | "azimuth";
  anglesDeg: readonly number[];
  gainDbi: readonly number[];
  /** Marks a direction of interest (take-off angle or peak bearing). */
  markDeg?: number | null;
  size?: number;
  title: string;
}

const RANGE_DB = 30;

export function PolarPlot({ kind, anglesDeg, gainDbi, markDeg, size = 168, title }: Props) {
  const finite = gainDbi.filter(Number.isFinite);
  if (anglesDeg.length < 2 || finite.length === 0) return <p className="muted">No pattern yet.</p>;
  const peak = Math.max(...finite);
  const floor = peak - RANGE_DB;
  const cx = size / 2;
  const half = kind === "elevation";
  const R = size / 2 - 14;
  // Half plot: room above for the 30°/60° ticks (at R + 8) and below the horizon for the ring labels
  // (at cy + 10), so neither the lobe nor a label falls outside the picture.
  const cy = half ? R + 12 : size / 2;
  const h = half ? R + 26 : size;
  const radius = (g: number) => ((Math.max(floor, Number.isFinite(g) ? g : floor) - floor) / RANGE_DB) * R;
  // Screen angle: elevation measured from the +x horizon counter-clockwise; azimuth clockwise from up.
  const at = (deg: number, r: number): [number, number] => {
    const a = (deg * Math.PI) / 180;
    return half ? [cx + r * Math.cos(a), cy - r * Math.sin(a)] : [cx + r * Math.sin(a), cy - r * Math.cos(a)];
  };
  const d = anglesDeg
    .map((deg, i) => {
      const [px, py] = at(deg, radius(gainDbi[i]));
      return `${i ? "L" : "M"}${px.toFixed(1)},${py.toFixed(1)}`;
    })
    .join("");
  const rings = [0, 10, 20].map((below) => peak - below);
  const spokes = half ? [0, 30, 60, 90, 120, 150, 180] : [0, 45, 90, 135, 180, 225, 270, 315];
  return (
    <figure className="polar">
      <svg width={size} height={h} viewBox={`0 0 ${size} ${h}`} role="img" aria-label={title}>
        {rings.map((g) => {
          const r = radius(g);
          return half ? (
            <path
              key={g}
              d={`M${cx - r},${cy} A${r},${r} 0 0 1 ${cx + r},${cy}`}
              className="chart-grid"
              fill="none"
            />
          ) : (
            <circle key={g} cx={cx} cy={cy} r={r} className="chart-grid" fill="none" />
          );
        })}
        {spokes.map((s) => {
          const [px, py] = at(s, R);
          return <line key={s} x1={cx} y1={cy} x2={px} y2={py} className="chart-grid" />;
        })}
        {!half && (
          <text x={cx} y={9} textAnchor="middle" className="chart-tick">
            N
          </text>
        )}
        {half &&
          [30, 60].map((s) => {
            const [px, py] = at(s, R + 8);
            return (
              <text key={s} x={px} y={py} textAnchor="middle" className="chart-tick">
                {s}°
              </text>
            );
          })}
        <path d={`${d}${half ? "" : "Z"}`} className="chart-lobe" />
        {markDeg != null &&
          (() => {
            const [px, py] = at(markDeg, R);
            return <line x1={cx} y1={cy} x2={px} y2={py} className="chart-resonance" />;
          })()}
        {rings.map((g) => {
          const [px, py] = half ? [cx + radius(g), cy + 10] : at(135, radius(g));
          return (
            <text key={`l${g}`} x={px} y={py} textAnchor="middle" className="chart-tick chart-ring-label">
              {g.toFixed(0)}
            </text>
          );
        })}
      </svg>
      <figcaption>
        {title} <span className="muted">(dBi)</span>
      </figcaption>
    </figure>
  );
}
