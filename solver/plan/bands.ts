import type { BandName } from "./schema";

/**
 * Amateur HF band edges by ITU region.
 *
 * Source: ITU Radio Regulations, Article 5 (Table of Frequency Allocations), the amateur service
 * allocations between 1.8 and 29.7 MHz. Values transcribed from memory, not from a copy of the
 * Regulations at hand. The 60 m entry is the worldwide secondary allocation 5351.5–5366.5 kHz added
 * by WRC-15 (also from memory); many administrations grant channels or a different segment instead.
 *
 * National allocations can be narrower than the ITU table (or, by footnote, differ): the user's licence
 * conditions decide what may be used. These edges only set the sweep range and the SWR-at-edge figures.
 */

export type ItuRegion = 1 | 2 | 3;

export interface Band {
  name: BandName;
  lowMHz: number;
  highMHz: number;
}

type Edges = [number, number];
/** [region 1, region 2, region 3] edges in MHz, or one pair when the same everywhere. */
const TABLE: Record<BandName, Edges | [Edges, Edges, Edges]> = {
  "160 m": [
    [1.81, 2.0],
    [1.8, 2.0],
    [1.8, 2.0],
  ],
  "80 m": [
    [3.5, 3.8],
    [3.5, 4.0],
    [3.5, 3.9],
  ],
  "60 m": [5.3515, 5.3665],
  "40 m": [
    [7.0, 7.2],
    [7.0, 7.3],
    [7.0, 7.2],
  ],
  "30 m": [10.1, 10.15],
  "20 m": [14.0, 14.35],
  "17 m": [18.068, 18.168],
  "15 m": [21.0, 21.45],
  "12 m": [24.89, 24.99],
  "10 m": [28.0, 29.7],
};

export const BAND_NAMES = Object.keys(TABLE) as BandName[];

/** The band's edges in the given ITU region. */
export function bandEdges(name: BandName, region: ItuRegion): Band {
  const entry = TABLE[name];
  const [lowMHz, highMHz] =
    typeof entry[0] === "number" ? (entry as Edges) : (entry as [Edges, Edges, Edges])[region - 1];
  return { name, lowMHz, highMHz };
}

/** Arithmetic centre of the band, MHz. */
export function bandCentre(band: Band): number {
  return (band.lowMHz + band.highMHz) / 2;
}
