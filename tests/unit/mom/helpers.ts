/** Small model builders shared by the MoM tests (SI units; frequencies in MHz as in WireModel). */
import type { GroundInput, WireModel } from "../../../solver/model/types";

export const C0 = 299_792_458;
/** Wavelength in metres at f MHz. */
export const lambdaAt = (mhz: number) => C0 / (mhz * 1e6);

/** Centre-fed straight dipole along z (free space) or along x at height h (over a ground). */
export function dipole(
  lengthM: number,
  radiusM: number,
  mhz: number | number[],
  opts: {
    height?: number;
    ground?: GroundInput;
    axis?: "x" | "z";
    material?: WireModel["wires"][0]["material"];
  } = {},
): WireModel {
  const h = opts.height ?? 0;
  const axis = opts.axis ?? (opts.height === undefined ? "z" : "x");
  const half = lengthM / 2;
  const points: [number, number, number][] =
    axis === "z"
      ? [
          [0, 0, h - half],
          [0, 0, h + half],
        ]
      : [
          [-half, 0, h],
          [half, 0, h],
        ];
  return {
    wires: [{ id: "dipole", points, radius: radiusM, material: opts.material }],
    feed: { wire: "dipole", at: 0.5 },
    ground: opts.ground ?? { kind: "free" },
    frequenciesMHz: Array.isArray(mhz) ? mhz : [mhz],
  };
}
