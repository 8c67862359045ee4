/** Test meshes built by hand (no moment method): straight wires with a prescribed current shape. */

import type { MeshView, SegmentCurrents, Vec3 } from "../../../solver/model/types";

export interface Wire {
  from: Vec3;
  to: Vec3;
  segments: number;
  /** Complex current [re, im] at fraction u (0..1) along the wire; sampled at the nodes, linear between. */
  current: (u: number) => [number, number];
}

export function buildMesh(wires: Wire[]): { mesh: MeshView; currents: SegmentCurrents } {
  const total = wires.reduce((s, w) => s + w.segments, 0);
  const starts = new Float64Array(3 * total);
  const ends = new Float64Array(3 * total);
  const startRe = new Float64Array(total);
  const startIm = new Float64Array(total);
  const endRe = new Float64Array(total);
  const endIm = new Float64Array(total);
  const wireOfSegment = new Int32Array(total);
  const wireStart = new Float64Array(total);
  const wireEnd = new Float64Array(total);
  let s = 0;
  wires.forEach((w, wi) => {
    const len = Math.hypot(w.to[0] - w.from[0], w.to[1] - w.from[1], w.to[2] - w.from[2]);
    for (let m = 0; m < w.segments; m++, s++) {
      const u0 = m / w.segments;
      const u1 = (m + 1) / w.segments;
      for (let c = 0; c < 3; c++) {
        starts[3 * s + c] = w.from[c] + u0 * (w.to[c] - w.from[c]);
        ends[3 * s + c] = w.from[c] + u1 * (w.to[c] - w.from[c]);
      }
      [startRe[s], startIm[s]] = w.current(u0);
      [endRe[s], endIm[s]] = w.current(u1);
      wireOfSegment[s] = wi;
      wireStart[s] = u0 * len;
      wireEnd[s] = u1 * len;
    }
  });
  return {
    mesh: {
      segments: total,
      starts,
      ends,
      radii: new Float64Array(total).fill(1e-3),
      wireOfSegment,
      wireStart,
      wireEnd,
    },
    currents: { startRe, startIm, endRe, endIm },
  };
}

/** Centre-fed dipole of total length L along unit vector axis, centred at c, with the standing-wave current
 *  I0 sin(k(L/2 − |s|)) / sin(kL/2) normalised to I0 at the feed (Balanis, Antenna Theory, eq. 4-56). */
export function sinusoidalDipole(
  c: Vec3,
  axis: Vec3,
  L: number,
  wavelength: number,
  segments: number,
  i0: [number, number] = [1, 0],
): Wire {
  const k = (2 * Math.PI) / wavelength;
  const h = L / 2;
  const norm = Math.sin(k * h);
  return {
    from: [c[0] - h * axis[0], c[1] - h * axis[1], c[2] - h * axis[2]],
    to: [c[0] + h * axis[0], c[1] + h * axis[1], c[2] + h * axis[2]],
    segments,
    current: (u) => {
      const f = Math.sin(k * (h - Math.abs(u * L - h))) / norm;
      return [i0[0] * f, i0[1] * f];
    },
  };
}

export const C = 299_792_458;
