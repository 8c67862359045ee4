import { memo, useMemo, useState } from "react";
import { type GroundInput, groundMethodWords } from "../../solver/model/types";
import type { BandAnalysis, PlanAnalysis, PlanGroundConnection } from "../../solver/plan/analysis-types";
import { findElement } from "../plan/elements";
import { freshness } from "../store/analysis-slice";
import { useApp, useAppStore } from "../store/react";
import { formatDb, formatLength, formatMHz, formatSwr } from "../units";
import { PolarPlot } from "./charts/PolarPlot";
import { SwrChart } from "./charts/SwrChart";

// A split that is zero to rounding shows as 0.0 %, not −0.0 %.
const pct = (x: number) => `${(Math.abs(x) < 5e-4 ? 0 : x * 100).toFixed(1)} %`;
const ohms = ([r, x]: [number, number]) =>
  `${r.toFixed(1)} ${x < 0 ? "−" : "+"} j${Math.abs(x).toFixed(1)} Ω`;

function Status() {
  const store = useAppStore();
  const state = useApp((s) => freshness(s));
  const running = useApp((s) => s.running);
  const failure = useApp((s) => s.failure);
  const result = useApp((s) => s.result);
  // Only the element the failure points at, not the whole plan (which changes on every drag step).
  const targetId = useApp((s) =>
    s.failure ? findElement(s.plan, s.failure.failure.elementId)?.id : undefined,
  );
  const revision = useApp((s) => s.revision);
  // Revisions as attributes: the bench and the browser tests match a shown result to the plan it is for.
  const revisions = { "data-plan-revision": revision, "data-result-revision": result?.revision ?? -1 };
  if (state === "failed" && failure) {
    const f = failure.failure;
    return (
      <div
        className="status status-error"
        role="alert"
        data-testid="analysis-status"
        data-state="failed"
        {...revisions}
      >
        <strong>This plan can’t be analysed.</strong> {f.message}
        {targetId && (
          <button type="button" className="link" onClick={() => store.getState().select(targetId)}>
            Show the element
          </button>
        )}
      </div>
    );
  }
  const busy = running ? (running.kind === "quick" ? "quick pass running…" : "full band sweep running…") : "";
  const text =
    state === "none"
      ? "Computing the first answer…"
      : state === "stale"
        ? "Results are for an earlier version of the plan."
        : state === "quick"
          ? "Quick pass (fewer frequencies, coarse pattern)."
          : `Up to date: full band sweep${result ? `, ${result.analysis.unknowns} unknowns, ${result.elapsedMs.toFixed(0)} ms` : ""}.`;
  return (
    <div
      className={`status status-${state}`}
      data-testid="analysis-status"
      data-state={state}
      aria-live="polite"
      {...revisions}
    >
      {text} {busy && <span className="busy">{busy}</span>}
    </div>
  );
}

function Figure({
  label,
  value,
  testId,
  note,
}: {
  label: string;
  value: string;
  testId?: string;
  note?: string;
}) {
  return (
    <div className="figure">
      <div className="figure-label">{label}</div>
      <div className="figure-value" data-testid={testId}>
        {value}
      </div>
      {note && <div className="figure-note">{note}</div>}
    </div>
  );
}

function PowerBar({ band }: { band: BandAnalysis }) {
  const p = band.power;
  const parts = [
    { k: "radiated", v: p.radiated, c: "var(--ok)" },
    { k: "wire loss", v: p.wireLoss, c: "var(--copper)" },
    { k: "load loss", v: p.loadLoss, c: "var(--amber)" },
    { k: "ground loss", v: p.groundLoss, c: "var(--earth)" },
  ];
  return (
    <figure className="powerbar" aria-label="Where the power goes">
      <div className="powerbar-track">
        {parts.map((x) => (
          <span
            key={x.k}
            style={{ width: `${Math.max(0, x.v) * 100}%`, background: x.c }}
            title={`${x.k}: ${pct(x.v)}`}
          />
        ))}
      </div>
      <ul className="powerbar-legend">
        {parts.map((x) => (
          <li key={x.k}>
            <i style={{ background: x.c }} /> {x.k} {pct(x.v)}
          </li>
        ))}
      </ul>
    </figure>
  );
}

function resonanceVerdict(band: BandAnalysis): { text: string; tone: string } {
  const inBand = band.resonancesMHz.filter((f) => f >= band.lowMHz && f <= band.highMHz);
  if (inBand.length) return { text: "resonant in the band", tone: "ok" };
  if (band.resonancesMHz.length === 0) {
    // No zero crossing in the sweep: the sign of the reactance says which way to trim.
    const x = band.feedImpedance[1];
    return {
      text:
        x > 0
          ? "no resonance in the sweep: too long (shorten)"
          : "no resonance in the sweep: too short (lengthen)",
      tone: "warn",
    };
  }
  const f = band.resonancesMHz[0];
  return {
    text: f < band.lowMHz ? "resonates below the band: shorten" : "resonates above the band: lengthen",
    tone: "warn",
  };
}

// Memoised, and reading only the unit and north from the plan: a drag step changes the plan but not
// these figures, which change only when a result arrives.
const BandResults = memo(function BandResults({
  analysis,
  band,
}: {
  analysis: PlanAnalysis;
  band: BandAnalysis;
}) {
  const units = useApp((s) => s.plan.units);
  const northDeg = useApp((s) => s.plan.lot.northDeg);
  const res = band.resonancesMHz.length
    ? band.resonancesMHz.reduce((a, b) =>
        Math.abs(b - band.centreMHz) < Math.abs(a - band.centreMHz) ? b : a,
      )
    : null;
  const verdict = resonanceVerdict(band);
  const cutEl = band.centre.elevationCut;
  const cutAz = band.centre.azimuthCut;
  const azAngles = useMemo(() => cutAz?.anglesDeg.map((a) => a - northDeg), [cutAz, northDeg]);
  return (
    <>
      <div className="headline" data-testid="vs-ideal">
        <div className="headline-value">{formatDb(band.vsIdealDipoleDb)}</div>
        <div className="headline-label">
          peak gain against an ideal straight dipole
          <span className="muted">
            {" "}
            ({formatLength(band.ideal.lengthM, units)} long at {formatLength(band.ideal.heightM, units)}, same
            ground; at this plan’s take-off angle {formatDb(band.vsIdealAtTakeoffDb)})
          </span>
        </div>
      </div>
      <div className="figures">
        <Figure
          label="Resonance"
          value={res === null ? "none in sweep" : formatMHz(res)}
          testId="resonance"
          note={verdict.text}
        />
        <Figure
          label="Best SWR"
          value={`${formatSwr(band.swrMin)} : 1`}
          testId="swr-min"
          note={`at ${formatMHz(band.swrMinMHz)}`}
        />
        <Figure
          label="SWR at band edges"
          value={`${formatSwr(band.swrAtEdges[0])} / ${formatSwr(band.swrAtEdges[1])}`}
          note={`${band.lowMHz.toFixed(3)} / ${band.highMHz.toFixed(3)} MHz`}
        />
        <Figure
          label="2:1 bandwidth"
          value={`${band.bandwidthCoversBand ? "≥ " : ""}${(band.bandwidth2to1MHz * 1000).toFixed(0)} kHz`}
          testId="bandwidth"
          note={band.bandwidthCoversBand ? "SWR under 2 across the whole band" : undefined}
        />
        <Figure
          label="Feed impedance"
          value={ohms(band.feedImpedance)}
          note={`at ${formatMHz(band.centreMHz)}, SWR against ${analysis.referenceOhms.toFixed(0)} Ω`}
        />
        <Figure
          label="Peak gain"
          value={`${band.peakGainDbi.toFixed(2)} dBi`}
          testId="peak-gain"
          note={`take-off ${band.takeoffDeg.toFixed(0)}°, bearing ${band.bearingDeg.toFixed(0)}° true`}
        />
      </div>
      <h3>SWR across {band.name}</h3>
      <SwrChart points={band.sweep} bandLowMHz={band.lowMHz} bandHighMHz={band.highMHz} resonanceMHz={res} />
      <h3>Efficiency {pct(band.efficiency)}</h3>
      <PowerBar band={band} />
      <h3>Pattern at {formatMHz(band.centreMHz)}</h3>
      <div className="polars">
        {cutEl && (
          <PolarPlot
            kind="elevation"
            title="Elevation, through the peak"
            anglesDeg={cutEl.anglesDeg}
            gainDbi={cutEl.gainDbi}
            markDeg={band.takeoffDeg}
          />
        )}
        {cutAz && azAngles && (
          <PolarPlot
            kind="azimuth"
            title={`Azimuth at ${band.takeoffDeg.toFixed(0)}°, true north up`}
            anglesDeg={azAngles}
            gainDbi={cutAz.gainDbi}
            markDeg={band.bearingDeg}
          />
        )}
      </div>
    </>
  );
});

/** The ground as the plan states it: a preset by name, explicit σ and εr as given (they override a preset). */
function groundText(g: GroundInput): string {
  if (g.kind === "perfect") return "perfect ground";
  if (g.kind === "free") return "free space";
  const stated = [
    g.preset,
    g.conductivity !== undefined ? `σ ${g.conductivity} S/m` : undefined,
    g.permittivity !== undefined ? `εr ${g.permittivity}` : undefined,
  ].filter((x) => x !== undefined);
  return stated.length ? stated.join(", ") : "real ground";
}

/** The tie's series impedance at the band centre, as the solver modelled it (a rod is no short at HF). */
function tieText(band: BandAnalysis, wire: string): string | null {
  const t = band.groundTies.find((g) => g.wire === wire);
  return t ? `≈ ${ohms(t.ohms)} at ${band.centre.mhz.toFixed(3)} MHz` : null;
}

function GroundTie({
  tie,
  current,
  series,
}: {
  tie: PlanGroundConnection;
  current: string | null;
  series: string | null;
}) {
  const store = useAppStore();
  // The element's name as a string (stable between drag steps, so a drag does not re-render this).
  const name = useApp((s) => {
    const e = findElement(s.plan, tie.elementId);
    const n = e?.kind === "support" ? e.support.name : e?.kind === "wireRun" ? e.run.name : "";
    return n || tie.elementId;
  });
  return (
    <li>
      <button
        type="button"
        className="ground-tie-element"
        onClick={() => store.getState().select(tie.elementId)}
        title="Select the element"
      >
        {name}
      </button>
      : {tie.label}
      {series && <span data-testid={`ground-tie-ohms-${tie.elementId}`}>; {series}</span>}
      {current && <span data-testid={`ground-current-${tie.elementId}`}>; {current}</span>}
    </li>
  );
}

/** One compact line: the plan's ground, the near-ground method that ran, and how each grounded element is tied. */
/**
 * How strongly a grounded element takes part, from the band-centre solution: its largest current
 * against the feed current (both for the same 1 W accepted, so the ratio holds at any power). A
 * grounded mast beside the antenna is a parasitic radiator; this says how much of one.
 */
function elementCurrent(analysis: PlanAnalysis, band: BandAnalysis, elementId: string): string | null {
  if (elementId === analysis.activeRunId) return null; // the antenna itself
  const wires = new Set(analysis.compiled.elementWires[elementId] ?? []);
  let peak = 0;
  for (const c of band.centre.currents) if (wires.has(c.wire)) peak = Math.max(peak, c.peakAmps);
  const feed = Math.hypot(...band.centre.feedCurrent);
  if (!(feed > 0) || wires.size === 0) return null;
  return `carries up to ${((100 * peak) / feed).toFixed(0)} % of the feed current at ${band.centre.mhz.toFixed(3)} MHz`;
}

function GroundReport({ analysis, band }: { analysis: PlanAnalysis; band: BandAnalysis }) {
  return (
    <div className="ground-report" data-testid="ground-report" data-method={analysis.groundMethod}>
      <span className="ground-report-title">Ground</span> {groundText(analysis.compiled.model.ground)} ·
      near-ground interactions: {groundMethodWords(analysis.groundMethod)}
      {analysis.groundConnections.length > 0 && (
        <ul>
          {analysis.groundConnections.map((c) => (
            <GroundTie
              key={c.wire}
              tie={c}
              current={elementCurrent(analysis, band, c.elementId)}
              series={tieText(band, c.wire)}
            />
          ))}
        </ul>
      )}
    </div>
  );
}

function Warnings({ analysis }: { analysis: PlanAnalysis }) {
  const store = useAppStore();
  if (analysis.warnings.length === 0) return <p className="muted">No warnings.</p>;
  return (
    <ul className="warnings" data-testid="warnings">
      {analysis.warnings.map((w) => (
        <li key={`${w.code}:${w.elementId ?? ""}:${w.message}`}>
          <button
            type="button"
            className="warning"
            disabled={!w.elementId}
            onClick={() => w.elementId && store.getState().select(w.elementId)}
            title={w.elementId ? "Select the element" : undefined}
          >
            <span className="warning-code">{w.code}</span> {w.message}
          </button>
        </li>
      ))}
    </ul>
  );
}

function Cautions({ analysis }: { analysis: PlanAnalysis | null }) {
  // Points are listed per band; a point is one place in the yard however many bands mark it.
  const n = new Set(analysis?.highVoltagePoints.map((p) => `${p.wire}@${p.point.join(",")}`)).size;
  return (
    <aside className="cautions" aria-label="Safety">
      <h3>Safety</h3>
      <p>
        <strong>High RF voltage at wire ends.</strong>{" "}
        {n > 0 ? `The ${n} marked point${n > 1 ? "s" : ""} (⚡) ` : "Free wire ends "}
        carry the highest voltage when you transmit: keep them out of reach, and keep people and pets away
        from the antenna while on the air.
      </p>
      <p>
        Keep well clear of power lines when putting wire up, and take care climbing. Defer to your local codes
        and licensed practice, and do an RF exposure evaluation for your power and station before you operate.
      </p>
    </aside>
  );
}

/** The answers, at a glance: status, headline, figures, charts, warnings, safety. */
export function Results() {
  const result = useApp((s) => s.result);
  // While dragging, every figure lags the pointer by one solve; dim only results that are really old.
  const old = useApp((s) => {
    const f = freshness(s);
    return f === "failed" || (f === "stale" && s.gestureOrigin === null && s.running === null);
  });
  const [bandIndex, setBandIndex] = useState(0);
  const analysis = result?.analysis ?? null;
  const band = analysis?.bands[Math.min(bandIndex, analysis.bands.length - 1)];
  return (
    <section className="panel results" aria-label="Results" data-testid="results">
      <h2>What the solver says</h2>
      <Status />
      {analysis && analysis.bands.length > 1 && (
        <div className="tabs" role="tablist">
          {analysis.bands.map((b, i) => (
            <button
              key={b.name}
              type="button"
              role="tab"
              aria-selected={i === bandIndex}
              onClick={() => setBandIndex(i)}
            >
              {b.name}
            </button>
          ))}
        </div>
      )}
      {analysis && band && (
        // Figures for an older plan stay readable but dimmed, under the status line that says so.
        <div className={old ? "results-old" : undefined}>
          <BandResults analysis={analysis} band={band} />
          <GroundReport analysis={analysis} band={band} />
        </div>
      )}
      {analysis && (
        <>
          <h3>Warnings</h3>
          <Warnings analysis={analysis} />
        </>
      )}
      <Cautions analysis={analysis} />
    </section>
  );
}
