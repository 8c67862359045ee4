/**
 * The radiation vector N(r̂) = Σ_seg ∫ I(l′) t̂ e^{jk r̂·r′} dl′ evaluated directly, segment by segment, in
 * one direction. Slow and plain on purpose: it is the yardstick the fast grid kernel (radiation.ts) is
 * tested against, and it serves single-direction queries.
 *
 * Per segment with midpoint c, length ℓ, x = (kℓ/2) r̂·t̂, mean current Ī and difference ΔI = I_end − I_start:
 *   ∫ I e^{jk r̂·r′} dl′ = ℓ e^{jk r̂·c} [Ī · sin x / x + j ΔI · (sin x − x cos x)/(2x²)].
 */

import type { MeshView, SegmentCurrents } from "../model/types";
import { rampTransform, sinc } from "./segment-transforms";

/** Complex 3-vector [xRe, xIm, yRe, yIm, zRe, zIm] in ampere-metres. */
export function radiationVectorAt(
  mesh: MeshView,
  currents: SegmentCurrents,
  k: number,
  rx: number,
  ry: number,
  rz: number,
): Float64Array {
  const out = new Float64Array(6);
  const { starts: s, ends: e } = mesh;
  for (let i = 0; i < mesh.segments; i++) {
    const dx = e[3 * i] - s[3 * i];
    const dy = e[3 * i + 1] - s[3 * i + 1];
    const dz = e[3 * i + 2] - s[3 * i + 2];
    const x = 0.5 * k * (rx * dx + ry * dy + rz * dz);
    const cx = s[3 * i] + 0.5 * dx;
    const cy = s[3 * i + 1] + 0.5 * dy;
    const cz = s[3 * i + 2] + 0.5 * dz;
    const psi = k * (rx * cx + ry * cy + rz * cz);
    const a = sinc(x);
    const b = rampTransform(x);
    const meanRe = 0.5 * (currents.startRe[i] + currents.endRe[i]);
    const meanIm = 0.5 * (currents.startIm[i] + currents.endIm[i]);
    const dRe = currents.endRe[i] - currents.startRe[i];
    const dIm = currents.endIm[i] - currents.startIm[i];
    // Ī a + j ΔI b
    const vRe = meanRe * a - dIm * b;
    const vIm = meanIm * a + dRe * b;
    const c = Math.cos(psi);
    const sn = Math.sin(psi);
    const qRe = vRe * c - vIm * sn;
    const qIm = vRe * sn + vIm * c;
    // ℓ t̂ = (dx, dy, dz)
    out[0] += qRe * dx;
    out[1] += qIm * dx;
    out[2] += qRe * dy;
    out[3] += qIm * dy;
    out[4] += qRe * dz;
    out[5] += qIm * dz;
  }
  return out;
}
