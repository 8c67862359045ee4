import { groundMethodWords } from "../model/types";
import type { PlanAnalysis } from "./analysis-types";
import { analyzePlan } from "./analyze";
import type { Plan } from "./schema";

/**
 * What the CLI prints for a plan (`npm run solve -- plan.json [--json]`). The lead's solver/cli.ts tells a
 * plan from a wire model with `isPlanDocument` (the version key), parses it with `parsePlan`, and calls
 * one of these. Both run the full (not quick) analysis.
 */
export { isPlanDocument } from "./schema";

const r = (v: number, digits: number) => (Number.isFinite(v) ? Number(v.toFixed(digits)) : v);

/** The issue's `bands: [...]` shape first, then what else is useful (ideal dipole, power split, warnings). */
export function planReportJson(plan: Plan, analysis: PlanAnalysis = analyzePlan(plan)): object {
  return {
    plan: plan.name,
    activeRun: analysis.activeRunId,
    referenceOhms: r(analysis.referenceOhms, 3),
    segments: analysis.segments,
    unknowns: analysis.unknowns,
    groundMethod: analysis.groundMethod,
    groundConnections: analysis.groundConnections,
    bands: analysis.bands.map((b) => ({
      name: b.name,
      lowMHz: b.lowMHz,
      highMHz: b.highMHz,
      // The resonance nearest the band centre (null if the reactance has no zero in the band).
      resonanceMHz: b.resonancesMHz.length
        ? r(
            b.resonancesMHz.reduce((a, c) => (Math.abs(c - b.centreMHz) < Math.abs(a - b.centreMHz) ? c : a)),
            4,
          )
        : null,
      resonancesMHz: b.resonancesMHz.map((f) => r(f, 4)),
      swrMin: r(b.swrMin, 3),
      swrMinMHz: r(b.swrMinMHz, 4),
      swrAtEdges: [r(b.swrAtEdges[0], 3), r(b.swrAtEdges[1], 3)],
      bandwidth2to1MHz: r(b.bandwidth2to1MHz, 4),
      bandwidthCoversBand: b.bandwidthCoversBand,
      feedImpedance: [r(b.feedImpedance[0], 2), r(b.feedImpedance[1], 2)],
      peakGainDbi: r(b.peakGainDbi, 2),
      takeoffDeg: r(b.takeoffDeg, 1),
      bearingDeg: r(b.bearingDeg, 1),
      vsIdealDipoleDb: r(b.vsIdealDipoleDb, 2),
      vsIdealAtTakeoffDb: r(b.vsIdealAtTakeoffDb, 2),
      efficiency: r(b.efficiency, 4),
      power: {
        radiated: r(b.power.radiated, 4),
        wireLoss: r(b.power.wireLoss, 4),
        loadLoss: r(b.power.loadLoss, 4),
        groundLoss: r(b.power.groundLoss, 4),
      },
      idealDipole: {
        heightM: r(b.ideal.heightM, 3),
        lengthM: r(b.ideal.lengthM, 3),
        resonanceMHz: r(b.ideal.resonanceMHz, 4),
        peakGainDbi: r(b.ideal.peakGainDbi, 2),
        takeoffDeg: r(b.ideal.takeoffDeg, 1),
      },
      groundTies: b.groundTies.map((t) => ({
        elementId: t.elementId,
        wire: t.wire,
        ohms: [r(t.ohms[0], 2), r(t.ohms[1], 2)],
      })),
      sweep: b.sweep.map((p) => ({
        mhz: r(p.mhz, 4),
        impedance: [r(p.impedance[0], 2), r(p.impedance[1], 2)],
        swr: r(p.swr, 3),
      })),
    })),
    warnings: analysis.warnings,
  };
}

const pad = (s: string, n: number) => (s.length >= n ? s : " ".repeat(n - s.length) + s);
const fmt = (v: number, d: number) => (Number.isFinite(v) ? v.toFixed(d) : "—");

/** A readable table per band. */
export function planReportText(plan: Plan, analysis: PlanAnalysis = analyzePlan(plan)): string {
  const lines: string[] = [];
  lines.push(
    `Plan: ${plan.name || "(unnamed)"} — fed run "${analysis.activeRunId}", SWR reference ${fmt(analysis.referenceOhms, 0)} Ω`,
  );
  lines.push(`Model: ${analysis.segments} segments, ${analysis.unknowns} unknowns`);
  lines.push(`Ground: ${groundMethodWords(analysis.groundMethod)}`);
  for (const c of analysis.groundConnections) lines.push(`  ${c.elementId} to ground: ${c.label}`);
  for (const b of analysis.bands) {
    lines.push("");
    lines.push(`${b.name}  ${b.lowMHz}–${b.highMHz} MHz`);
    const res = b.resonancesMHz.length
      ? b.resonancesMHz.map((f) => `${fmt(f, 3)} MHz`).join(", ")
      : "none in band";
    lines.push(`  resonance           ${res}`);
    lines.push(`  lowest SWR          ${fmt(b.swrMin, 2)} at ${fmt(b.swrMinMHz, 3)} MHz`);
    lines.push(`  SWR at band edges   ${fmt(b.swrAtEdges[0], 2)} / ${fmt(b.swrAtEdges[1], 2)}`);
    lines.push(
      `  2:1 bandwidth       ${fmt(b.bandwidth2to1MHz * 1000, 0)} kHz${b.bandwidthCoversBand ? " (the whole band)" : ""}`,
    );
    lines.push(
      `  feed impedance      ${fmt(b.feedImpedance[0], 1)} ${b.feedImpedance[1] < 0 ? "−" : "+"} j${fmt(Math.abs(b.feedImpedance[1]), 1)} Ω at ${fmt(b.centreMHz, 3)} MHz`,
    );
    lines.push(
      `  peak gain           ${fmt(b.peakGainDbi, 2)} dBi at ${fmt(b.takeoffDeg, 0)}° elevation, bearing ${fmt(b.bearingDeg, 0)}° true`,
    );
    lines.push(
      `  vs ideal dipole     ${fmt(b.vsIdealDipoleDb, 2)} dB peak, ${fmt(b.vsIdealAtTakeoffDb, 2)} dB at the take-off angle (dipole ${fmt(b.ideal.lengthM, 2)} m at ${fmt(b.ideal.heightM, 1)} m)`,
    );
    lines.push(
      `  efficiency          ${fmt(b.efficiency * 100, 1)} %  (wire ${fmt(b.power.wireLoss * 100, 1)} %, loads ${fmt(b.power.loadLoss * 100, 1)} %, ground ${fmt(b.power.groundLoss * 100, 1)} %)`,
    );
    for (const t of b.groundTies) {
      lines.push(
        `  ground tie          ${t.elementId}: ${fmt(t.ohms[0], 1)} ${t.ohms[1] < 0 ? "−" : "+"} j${fmt(Math.abs(t.ohms[1]), 1)} Ω in series at ${fmt(b.centreMHz, 3)} MHz`,
      );
    }
    lines.push(`  sweep:   MHz      R (Ω)     X (Ω)    SWR`);
    for (const p of b.sweep) {
      lines.push(
        `        ${pad(fmt(p.mhz, 3), 7)} ${pad(fmt(p.impedance[0], 1), 9)} ${pad(fmt(p.impedance[1], 1), 9)} ${pad(fmt(p.swr, 2), 6)}`,
      );
    }
  }
  if (analysis.warnings.length) {
    lines.push("");
    lines.push("Warnings:");
    for (const w of analysis.warnings)
      lines.push(`  [${w.code}] ${w.elementId ? `${w.elementId}: ` : ""}${w.message}`);
  }
  lines.push("");
  lines.push(
    "Caution: wire ends carry high RF voltage; keep antennas clear of power lines; follow local codes.",
  );
  return lines.join("\n");
}
