/**
 * Line charge on each segment from the continuity equation, e^{jωt}:  ∇·J + jωρ = 0  ⇒  q = −(1/jω) dI/dl
 * = (j/ω) dI/dl (Balanis, Antenna Theory, 4th ed., §4.2; Harrington, Field Computation by Moment Methods).
 * With linear current on a segment, dI/dl = (I_end − I_start)/ℓ, so q is constant along it (C/m).
 *
 * Where current is discontinuous (a segment end that is a free wire end with current left on it, or two
 * segments whose currents differ at the shared node) the charge is a point charge Q = (I_in − I_out)/(jω)
 * at that node; `nodeCharges` gives it per segment end so that callers can sum coincident ends. With the
 * rooftop basis the current is continuous and vanishes at free ends, so these are zero up to rounding.
 */

import type { MeshView, SegmentCurrents } from "../model/types";
import { checkMeshAndCurrents, checkPositive } from "./validate";

export interface SegmentCharges {
  /** Line charge per segment, coulombs per metre. */
  re: Float64Array;
  im: Float64Array;
}

export function segmentCharges(
  mesh: MeshView,
  currents: SegmentCurrents,
  frequencyHz: number,
): SegmentCharges {
  checkMeshAndCurrents(mesh, currents);
  checkPositive("frequencyHz", frequencyHz, "frequency");
  const omega = 2 * Math.PI * frequencyHz;
  const n = mesh.segments;
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  const { starts: s, ends: e } = mesh;
  for (let i = 0; i < n; i++) {
    const len = Math.hypot(e[3 * i] - s[3 * i], e[3 * i + 1] - s[3 * i + 1], e[3 * i + 2] - s[3 * i + 2]);
    const dRe = (currents.endRe[i] - currents.startRe[i]) / len;
    const dIm = (currents.endIm[i] - currents.startIm[i]) / len;
    // (j/ω)(a + jb) = (−b + ja)/ω
    re[i] = -dIm / omega;
    im[i] = dRe / omega;
  }
  return { re, im };
}

export interface EndCharges {
  /** Point charge at each segment's start and end if the segment stood alone: −I_start/(jω) at the start
   *  (current leaving) and +I_end/(jω) at the end (current arriving), coulombs. Summed over the segments
   *  meeting at a node they give that node's point charge; with the line charge they conserve charge. */
  startRe: Float64Array;
  startIm: Float64Array;
  endRe: Float64Array;
  endIm: Float64Array;
}

export function endCharges(mesh: MeshView, currents: SegmentCurrents, frequencyHz: number): EndCharges {
  checkMeshAndCurrents(mesh, currents);
  checkPositive("frequencyHz", frequencyHz, "frequency");
  const omega = 2 * Math.PI * frequencyHz;
  const n = mesh.segments;
  const out: EndCharges = {
    startRe: new Float64Array(n),
    startIm: new Float64Array(n),
    endRe: new Float64Array(n),
    endIm: new Float64Array(n),
  };
  for (let i = 0; i < n; i++) {
    // I/(jω) = −jI/ω = (b − ja)/ω for I = a + jb.
    out.endRe[i] = currents.endIm[i] / omega;
    out.endIm[i] = -currents.endRe[i] / omega;
    out.startRe[i] = -currents.startIm[i] / omega;
    out.startIm[i] = currents.startRe[i] / omega;
  }
  return out;
}
