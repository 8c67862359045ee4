/**
 * Far-field benchmark (not a test: speed is measured here, never asserted). Run with
 *   npx tsx tests/unit/fields/bench-farfield.ts
 * Prints the median wall time and CPU time of computeFarField for ~200-segment models on the 2° grid
 * (and the 5° quick pass), over perfect and real ground and in free space.
 */

import { computeFarField } from "../../../solver/fields/farfield";
import type { FarFieldGround } from "../../../solver/fields/types";
import { buildMesh, type Wire } from "./helpers";

const cur = (u: number): [number, number] => [Math.sin(Math.PI * u), 0.3 * Math.cos(3 * u)];
const models: Record<string, Wire[]> = {
  "dipole, 2 runs x 100, level": [
    { from: [-20, 0, 10], to: [0, 0, 10], segments: 100, current: cur },
    { from: [0, 0, 10], to: [20, 0, 10], segments: 100, current: cur },
  ],
  "bent wire, 4 runs x 50, sloped": [
    { from: [-20, 0, 8], to: [-10, 2, 10], segments: 50, current: cur },
    { from: [-10, 2, 10], to: [0, 0, 12], segments: 50, current: cur },
    { from: [0, 0, 12], to: [10, -3, 10], segments: 50, current: cur },
    { from: [10, -3, 10], to: [20, 0, 7], segments: 50, current: cur },
  ],
  "sagging wire, 20 runs x 10": Array.from(
    { length: 20 },
    (_, i): Wire => ({
      from: [-20 + 2 * i, 0, 10 - 0.02 * (i - 10) ** 2],
      to: [-18 + 2 * i, 0, 10 - 0.02 * (i - 9) ** 2],
      segments: 10,
      current: cur,
    }),
  ),
  "worst case, 200 runs x 1 (zigzag)": Array.from(
    { length: 200 },
    (_, i): Wire => ({
      from: [i * 0.2, (i % 2) * 0.1, 10 + (i % 2) * 0.1],
      to: [(i + 1) * 0.2, ((i + 1) % 2) * 0.1, 10 + ((i + 1) % 2) * 0.1],
      segments: 1,
      current: cur,
    }),
  ),
};
const grounds: Record<string, FarFieldGround> = {
  free: { kind: "free" },
  perfect: { kind: "perfect" },
  real: { kind: "real", permittivity: 13, conductivity: 0.005 },
};

const cpuMs = () => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};
const median = (a: number[]) => [...a].sort((x, y) => x - y)[Math.floor(a.length / 2)];

for (const [name, wires] of Object.entries(models)) {
  const { mesh, currents } = buildMesh(wires);
  for (const [gname, ground] of Object.entries(grounds)) {
    for (const stepDeg of [2, 5]) {
      const req = {
        mesh,
        currents,
        frequencyHz: 7.1e6,
        ground,
        acceptedWatts: 1,
        stepDeg,
        keepPattern: false,
      };
      for (let i = 0; i < 5; i++) computeFarField(req);
      const wall: number[] = [];
      const cpu: number[] = [];
      for (let i = 0; i < 21; i++) {
        const t = performance.now();
        const c = cpuMs();
        computeFarField(req);
        cpu.push(cpuMs() - c);
        wall.push(performance.now() - t);
      }
      console.log(
        `${name.padEnd(36)} ${gname.padEnd(8)} ${stepDeg}°  median ${median(wall).toFixed(2)} ms wall, ${median(cpu).toFixed(2)} ms cpu`,
      );
    }
  }
}
