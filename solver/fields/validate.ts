/** Input checks shared by the field computations: a clear message naming the bad entry, never a crash. */

import { ModelError } from "../model/errors";
import type { MeshView, SegmentCurrents } from "../model/types";

export function checkMeshAndCurrents(mesh: MeshView, currents: SegmentCurrents): void {
  const n = mesh?.segments;
  if (!Number.isInteger(n) || n < 0)
    throw new ModelError("mesh.segments", `must be a whole number ≥ 0, got ${n}`);
  for (const key of ["starts", "ends"] as const) {
    const a = mesh[key];
    if (!a || a.length < 3 * n)
      throw new ModelError(`mesh.${key}`, `needs ${3 * n} coordinates for ${n} segments`);
  }
  for (const key of ["startRe", "startIm", "endRe", "endIm"] as const) {
    const a = currents?.[key];
    if (!a || a.length < n) throw new ModelError(`currents.${key}`, `needs ${n} values for ${n} segments`);
  }
  const { starts: s, ends: e } = mesh;
  for (let i = 0; i < n; i++) {
    const len = Math.hypot(e[3 * i] - s[3 * i], e[3 * i + 1] - s[3 * i + 1], e[3 * i + 2] - s[3 * i + 2]);
    if (!Number.isFinite(len))
      throw new ModelError(`mesh segment ${i}`, "has a coordinate that is not a finite number");
    if (len === 0) throw new ModelError(`mesh segment ${i}`, "has zero length (start and end coincide)");
    const c = currents.startRe[i] + currents.startIm[i] + currents.endRe[i] + currents.endIm[i];
    if (!Number.isFinite(c))
      throw new ModelError(`currents segment ${i}`, "has a current that is not a finite number");
  }
}

export function checkPositive(path: string, value: number, what: string): void {
  if (!Number.isFinite(value) || value <= 0)
    throw new ModelError(path, `${what} must be a positive number, got ${value}`);
}
