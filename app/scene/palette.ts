/** The yard's colours, in one place. Our own palette: muted garden tones, copper wire, clear warnings. */
export const palette = {
  sky: "#e6ecef",
  ground: "#cdd8c3",
  gridMinor: "#b9c7ad",
  gridMajor: "#93a686",
  lot: "#4d5e43",
  north: "#23404f",
  trunk: "#6e4f35",
  canopy: "#6d9a58",
  metal: "#8d99a6",
  wood: "#b4864b",
  fibreglass: "#d6c583",
  groundTie: "#3a3a3a",
  insulatorBase: "#f3efe4",
  wall: "#ddd3c3",
  roof: "#8b4e3b",
  fence: "#9d8767",
  fenceMetal: "#7d8894",
  walkway: "#e0d4ba",
  keepOut: "#cf4a3c",
  powerLine: "#1d1d1d",
  powerLineWarn: "#e2b100",
  wire: "#b8733b",
  rope: "#cfc3a5",
  insulator: "#fbfaf6",
  feed: "#0f7c8a",
  selected: "#2f6fd0",
  hover: "#5a91e0",
  highVoltage: "#d62f2f",
  lobe: "#3466a8",
} as const;

/** |I| relative to the peak, 0..1 → a blue-to-amber-to-red ramp for the current overlay. */
export function currentColour(t: number): [number, number, number] {
  const stops: [number, [number, number, number]][] = [
    [0, [0.16, 0.42, 0.72]],
    [0.5, [0.99, 0.68, 0.38]],
    [1, [0.84, 0.1, 0.11]],
  ];
  const x = Math.min(1, Math.max(0, t));
  for (let i = 1; i < stops.length; i++) {
    const [t1, c1] = stops[i];
    const [t0, c0] = stops[i - 1];
    if (x <= t1) {
      const f = (x - t0) / (t1 - t0);
      return [c0[0] + (c1[0] - c0[0]) * f, c0[1] + (c1[1] - c0[1]) * f, c0[2] + (c1[2] - c0[2]) * f];
    }
  }
  return stops[stops.length - 1][1];
}
