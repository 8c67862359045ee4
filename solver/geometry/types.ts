import type { LoadInput, MeshView, Warning } from "../model/types";
import type { SegmentSet } from "../mom/segments";

/** A place where a lumped element or the feed sits: at the start or end of one segment. */
export interface Port {
  segment: number;
  /** True when the port is at the segment's end node, false at its start node. */
  atEnd: boolean;
}

/**
 * The segmented model with its basis functions. Each basis is a triangle (rooftop) made of pieces;
 * a piece lives on one segment and is sign·u (rising to its end node) or sign·(1 − u) (falling from
 * its start node), current positive along the segment direction.
 */
export interface Mesh {
  view: MeshView;
  segs: SegmentSet;
  wireIds: string[];
  nBasis: number;
  pieceBasis: Int32Array;
  pieceSeg: Int32Array;
  /** 1: the piece is u (peak at the segment's end); 0: the piece is 1 − u (peak at its start). */
  pieceAtEnd: Uint8Array;
  pieceSign: Float64Array;
  /** Pieces grouped by segment: segPieces[segPieceStart[s] .. segPieceStart[s+1]) are piece ids. */
  segPieceStart: Int32Array;
  segPieces: Int32Array;
  feed: Port;
  loads: { port: Port; load: LoadInput; index: number }[];
  /** Wire ends on z = 0 joined to the ground (half triangles), with their wire index. */
  groundPorts: { port: Port; wire: number }[];
  /** Conductivity per segment in S/m; Infinity for a perfect conductor. */
  conductivity: Float64Array;
  warnings: Warning[];
}
