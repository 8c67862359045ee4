/** SWR across the band: a clean SVG line with the band edges, the 2:1 line and the resonance marked. */
export interface SwrPoint {
  mhz: number;
  swr: number;
}

interface Props {
  points: readonly SwrPoint[];
  bandLowMHz: number;
  bandHighMHz: number;
  resonanceMHz?: number | null;
  width?: number;
  height?: number;
}

const SWR_TOP = 5; // Above 5:1 the exact figure matters little for a backyard dipole; clip the axis there.

export function SwrChart({
  points,
  bandLowMHz,
  bandHighMHz,
  resonanceMHz,
  width = 320,
  height = 170,
}: Props) {
  if (points.length < 2) return <p className="muted">No sweep yet.</p>;
  // Right padding wide enough for the centred upper-edge frequency label ("14.350").
  const pad = { l: 34, r: 20, t: 10, b: 30 };
  const f0 = Math.min(points[0].mhz, bandLowMHz);
  const f1 = Math.max(points[points.length - 1].mhz, bandHighMHz);
  const span = f1 - f0 || 1;
  const x = (f: number) => pad.l + ((f - f0) / span) * (width - pad.l - pad.r);
  const y = (s: number) =>
    pad.t + (1 - (Math.min(s, SWR_TOP) - 1) / (SWR_TOP - 1)) * (height - pad.t - pad.b);
  const path = points.map((p, i) => `${i ? "L" : "M"}${x(p.mhz).toFixed(1)},${y(p.swr).toFixed(1)}`).join("");
  const ticks = [1, 1.5, 2, 3, 4, 5];
  const fTicks = [f0, (f0 + f1) / 2, f1];
  return (
    <svg
      className="chart"
      width={width}
      height={height}
      viewBox={`0 0 ${width} ${height}`}
      role="img"
      aria-label="SWR across the band"
      data-testid="swr-chart"
    >
      <rect
        x={x(bandLowMHz)}
        y={pad.t}
        width={Math.max(0, x(bandHighMHz) - x(bandLowMHz))}
        height={height - pad.t - pad.b}
        className="chart-band"
      />
      {ticks.map((t) => (
        <g key={t}>
          <line
            x1={pad.l}
            x2={width - pad.r}
            y1={y(t)}
            y2={y(t)}
            className={t === 2 ? "chart-limit" : "chart-grid"}
          />
          <text x={pad.l - 4} y={y(t) + 3} textAnchor="end" className="chart-tick">
            {t}
          </text>
        </g>
      ))}
      {[bandLowMHz, bandHighMHz].map((f) => (
        <line key={f} x1={x(f)} x2={x(f)} y1={pad.t} y2={height - pad.b} className="chart-edge" />
      ))}
      {fTicks.map((f) => (
        <text key={f} x={x(f)} y={height - pad.b + 13} textAnchor="middle" className="chart-tick">
          {f.toFixed(3)}
        </text>
      ))}
      <text x={(pad.l + width - pad.r) / 2} y={height - 3} textAnchor="middle" className="chart-axis">
        frequency, MHz
      </text>
      <text
        x={10}
        y={pad.t + (height - pad.t - pad.b) / 2}
        className="chart-axis"
        textAnchor="middle"
        transform={`rotate(-90 10 ${pad.t + (height - pad.t - pad.b) / 2})`}
      >
        SWR
      </text>
      <path d={path} className="chart-line" />
      {resonanceMHz != null && resonanceMHz >= f0 && resonanceMHz <= f1 && (
        <g>
          <line
            x1={x(resonanceMHz)}
            x2={x(resonanceMHz)}
            y1={pad.t}
            y2={height - pad.b}
            className="chart-resonance"
          />
          <text x={x(resonanceMHz) + 3} y={pad.t + 9} className="chart-tick">
            f₀
          </text>
        </g>
      )}
    </svg>
  );
}
