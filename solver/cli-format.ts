import { type FrequencyResult, groundMethodWords, type SolveResult } from "./model/types";

/** The CLI's `--json` shape for a wire model (the documented keys first; more may follow). */
export function solveResultJson(result: SolveResult, withCurrents = false, withPattern = false): object {
  return {
    segments: result.segments,
    unknowns: result.unknowns,
    groundMethod: result.groundMethod,
    groundConnections: result.groundConnections,
    results: result.results.map((r) => frequencyJson(r, result, withCurrents, withPattern)),
    resonancesMHz: result.resonancesMHz.map((f) => round(f, 6)),
    warnings: result.warnings,
  };
}

function frequencyJson(
  r: FrequencyResult,
  result: SolveResult,
  withCurrents: boolean,
  withPattern: boolean,
): object {
  const out: Record<string, unknown> = {
    mhz: round(r.mhz, 6),
    impedance: [round(r.impedance[0], 4), round(r.impedance[1], 4)],
    swr: round(r.swr, 4),
    peakGainDbi: round(r.peakGainDbi, 3),
    peakElevationDeg: round(r.peakElevationDeg, 2),
    peakBearingDeg: round(r.peakBearingDeg, 2),
    efficiency: round(r.efficiency, 5),
    directivityDbi: round(r.directivityDbi, 3),
    power: {
      accepted: round(r.power.accepted, 6),
      radiated: round(r.power.radiated, 6),
      wireLoss: round(r.power.wireLoss, 6),
      loadLoss: round(r.power.loadLoss, 6),
      groundLoss: round(r.power.groundLoss, 6),
    },
    currents: r.currents.map((c) => ({ wire: c.wire, peakAmps: round(c.peakAmps, 6) })),
  };
  if (withPattern && r.pattern) {
    // Row-major [elevation][bearing], dBi: total and the two polarisations.
    const p = r.pattern;
    const rows = (a: Float64Array) =>
      p.elevationsDeg.map((_, i) =>
        Array.from(a.subarray(i * p.bearingsDeg.length, (i + 1) * p.bearingsDeg.length), (v) => round(v, 2)),
      );
    out.pattern = {
      elevationsDeg: p.elevationsDeg,
      bearingsDeg: p.bearingsDeg,
      gainDbi: rows(p.gainDbi),
      verticalDbi: rows(p.verticalDbi),
      horizontalDbi: rows(p.horizontalDbi),
    };
  }
  if (withCurrents) {
    // Current at both ends of every segment, for 1 W accepted, in the wire's own order.
    const m = result.mesh;
    const c = r.segmentCurrents;
    out.segmentCurrents = Array.from({ length: m.segments }, (_, s) => ({
      wireIndex: m.wireOfSegment[s],
      fromM: round(m.wireStart[s], 4),
      toM: round(m.wireEnd[s], 4),
      start: [round(c.startRe[s], 7), round(c.startIm[s], 7)],
      end: [round(c.endRe[s], 7), round(c.endIm[s], 7)],
    }));
  }
  return out;
}

function round(v: number, digits: number): number {
  if (!Number.isFinite(v)) return v;
  const f = 10 ** digits;
  return Math.round(v * f) / f;
}

const pad = (s: string, n: number) => s.padStart(n);

/** A readable table: one row per frequency, then resonances and warnings. */
export function solveResultText(result: SolveResult): string {
  const lines: string[] = [];
  lines.push(`${result.segments} segments, ${result.unknowns} unknowns. Currents for 1 W accepted.`);
  lines.push(`ground: ${groundMethodWords(result.groundMethod)} (groundMethod "${result.groundMethod}")`);
  for (const c of result.groundConnections) lines.push(`  wire "${c.wire}" to ground: ${c.label}`);
  lines.push("");
  lines.push(
    [
      pad("MHz", 10),
      pad("R (Ω)", 10),
      pad("X (Ω)", 10),
      pad("SWR", 8),
      pad("gain dBi", 9),
      pad("elev °", 7),
      pad("bearing °", 10),
      pad("effic %", 8),
    ].join(""),
  );
  for (const r of result.results) {
    lines.push(
      [
        pad(r.mhz.toFixed(4), 10),
        pad(r.impedance[0].toFixed(2), 10),
        pad(r.impedance[1].toFixed(2), 10),
        pad(r.swr > 99 ? ">99" : r.swr.toFixed(2), 8),
        pad(Number.isFinite(r.peakGainDbi) ? r.peakGainDbi.toFixed(2) : "–", 9),
        pad(Number.isFinite(r.peakElevationDeg) ? r.peakElevationDeg.toFixed(0) : "–", 7),
        pad(Number.isFinite(r.peakBearingDeg) ? r.peakBearingDeg.toFixed(0) : "–", 10),
        pad(Number.isFinite(r.efficiency) ? (100 * r.efficiency).toFixed(1) : "–", 8),
      ].join(""),
    );
  }
  lines.push("");
  lines.push(
    result.resonancesMHz.length
      ? `Resonance (feed reactance crosses zero): ${result.resonancesMHz.map((f) => `${f.toFixed(4)} MHz`).join(", ")}`
      : "No resonance inside the swept range.",
  );
  for (const w of result.warnings) lines.push(`warning: ${w.message}`);
  return lines.join("\n");
}
