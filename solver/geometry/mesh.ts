/**
 * Wires → segments, nodes, junctions and triangle basis functions (Harrington 1968 §4; Gibson ch. 5).
 *
 * - Interior node of a wire: one triangle over the two segments meeting there.
 * - Wire ends that coincide (within a tolerance of 1e-6 of the model size) form a junction; M ends
 *   carry M − 1 triangles, each pairing the first end with one other, so current is conserved.
 * - A lone wire end is free: no basis, current zero there.
 * - Over a ground, an end on z = 0 is a ground node: a half triangle on the real segment, whose image
 *   supplies the other half (solver/ground/kernel.ts).
 */
import { ModelError } from "../model/errors";
import { conductivityOf } from "../model/materials";
import type { LoadInput, Vec3, Warning, WireModel } from "../model/types";
import { makeSegmentSet } from "../mom/segments";
import { autoNodes, fixedNodes, pointAt, vertexDistances } from "./segmentation";
import type { Mesh, Port } from "./types";
import { geometryWarnings } from "./warnings";

export const LIGHT_SPEED = 299_792_458;

export interface MeshOptions {
  /** Highest frequency the mesh must serve (sets automatic segment length). */
  maxFrequencyHz: number;
  segmentsPerWavelength: number;
  /** A ground plane exists at z = 0: points below are errors and z = 0 ends connect to it. */
  ground: boolean;
}

interface End {
  wire: number;
  segment: number;
  atEnd: boolean;
  p: Vec3;
}

export function buildMesh(model: WireModel, opt: MeshOptions): Mesh {
  const warnings: Warning[] = [];
  const wires = model.wires;
  if (wires.length === 0) throw new ModelError("wires", "the model has no wires");
  let extent = 0;
  for (const w of wires)
    for (const p of w.points) extent = Math.max(extent, Math.abs(p[0]), Math.abs(p[1]), p[2]);
  const tol = 1e-6 * Math.max(1, extent);
  const lambdaMin = LIGHT_SPEED / opt.maxFrequencyHz;
  const maxLen = lambdaMin / opt.segmentsPerWavelength;

  const index = new Map<string, number>();
  wires.forEach((w, i) => {
    if (index.has(w.id)) throw new ModelError(`wires[${i}].id`, `wire id "${w.id}" is used twice`);
    index.set(w.id, i);
    validateWire(model, i, tol, opt.ground);
  });

  const wireOf = (path: string, id: string): number => {
    const i = index.get(id);
    if (i === undefined) throw new ModelError(`${path}.wire`, `no wire with id "${id}"`);
    return i;
  };
  const checkAt = (path: string, at: number) => {
    if (!(at >= 0 && at <= 1))
      throw new ModelError(`${path}.at`, `position ${at} is outside 0..1 of the wire`);
  };
  const feedWire = wireOf("feed", model.feed.wire);
  checkAt("feed", model.feed.at);
  const loads = model.loads ?? [];
  const loadWires = loads.map((l, i) => {
    checkAt(`loads[${i}]`, l.at);
    return wireOf(`loads[${i}]`, l.wire);
  });

  // Node distances per wire.
  const cums = wires.map((w) => vertexDistances(w.points));
  const nodeLists: number[][] = wires.map((w, i) => {
    const cum = cums[i];
    if (w.segments !== undefined) return fixedNodes(cum, Math.max(1, Math.round(w.segments)));
    const req: number[] = [];
    if (feedWire === i) req.push(model.feed.at * cum[cum.length - 1]);
    loads.forEach((l, j) => {
      if (loadWires[j] === i) req.push(l.at * cum[cum.length - 1]);
    });
    return autoNodes(cum, maxLen, req, tol);
  });
  wires.forEach((w, i) => {
    if (w.segments !== undefined && nodeLists[i].length - 1 > Math.round(w.segments)) {
      warnings.push({
        code: "segments-raised",
        message: `wire "${w.id}" needs at least one segment per straight run; using ${nodeLists[i].length - 1}`,
        wire: w.id,
        path: `wires[${i}].segments`,
      });
    }
  });

  // Segments.
  const nSeg = nodeLists.reduce((a, l) => a + l.length - 1, 0);
  const starts = new Float64Array(3 * nSeg);
  const ends = new Float64Array(3 * nSeg);
  const radii = new Float64Array(nSeg);
  const wireOfSegment = new Int32Array(nSeg);
  const wireStart = new Float64Array(nSeg);
  const wireEnd = new Float64Array(nSeg);
  const conductivity = new Float64Array(nSeg);
  const firstSeg: number[] = [];
  const snapZ = (p: Vec3): Vec3 => (opt.ground && Math.abs(p[2]) < tol ? [p[0], p[1], 0] : p);
  let s = 0;
  wires.forEach((w, i) => {
    firstSeg.push(s);
    const nodes = nodeLists[i];
    const sigma = conductivityOf(w.material);
    for (let j = 0; j + 1 < nodes.length; j++, s++) {
      const a = snapZ(pointAt(w.points, cums[i], nodes[j]));
      const b = snapZ(pointAt(w.points, cums[i], nodes[j + 1]));
      starts.set(a, 3 * s);
      ends.set(b, 3 * s);
      radii[s] = w.radius;
      wireOfSegment[s] = i;
      wireStart[s] = nodes[j];
      wireEnd[s] = nodes[j + 1];
      conductivity[s] = sigma;
    }
  });
  firstSeg.push(s);

  // Basis functions.
  const pb: number[] = [];
  const ps: number[] = [];
  const pe: number[] = [];
  const pg: number[] = [];
  let nBasis = 0;
  const piece = (seg: number, atEnd: boolean, sign: number) => {
    pb.push(nBasis);
    ps.push(seg);
    pe.push(atEnd ? 1 : 0);
    pg.push(sign);
  };
  wires.forEach((_, i) => {
    for (let seg = firstSeg[i]; seg + 1 < firstSeg[i + 1]; seg++) {
      piece(seg, true, 1);
      piece(seg + 1, false, 1);
      nBasis++;
    }
  });
  const wireEnds: End[] = [];
  wires.forEach((w, i) => {
    wireEnds.push({ wire: i, segment: firstSeg[i], atEnd: false, p: snapZ(w.points[0]) });
    wireEnds.push({
      wire: i,
      segment: firstSeg[i + 1] - 1,
      atEnd: true,
      p: snapZ(w.points[w.points.length - 1]),
    });
  });
  const clusters: End[][] = [];
  for (const e of wireEnds) {
    const c = clusters.find((c) => dist(c[0].p, e.p) <= tol);
    if (c) c.push(e);
    else clusters.push([e]);
  }
  /** Per wire end (2·wire + (atEnd ? 1 : 0)): does the end carry current? */
  const endLive = new Uint8Array(2 * wires.length);
  const groundPorts: { port: Port; wire: number }[] = [];
  for (const c of clusters) {
    if (opt.ground && c[0].p[2] === 0) {
      for (const e of c) {
        piece(e.segment, e.atEnd, 1);
        nBasis++;
        groundPorts.push({ port: { segment: e.segment, atEnd: e.atEnd }, wire: e.wire });
        endLive[2 * e.wire + (e.atEnd ? 1 : 0)] = 1;
      }
    } else if (c.length >= 2) {
      const ref = c[0];
      for (let j = 1; j < c.length; j++) {
        const e = c[j];
        piece(ref.segment, ref.atEnd, ref.atEnd ? 1 : -1); // into the node along ref
        piece(e.segment, e.atEnd, e.atEnd ? -1 : 1); // out of the node along e
        nBasis++;
      }
      for (const e of c) endLive[2 * e.wire + (e.atEnd ? 1 : 0)] = 1;
    }
  }
  const nPieces = pb.length;
  const pieceBasis = Int32Array.from(pb);
  const pieceSeg = Int32Array.from(ps);
  const pieceAtEnd = Uint8Array.from(pe);
  const pieceSign = Float64Array.from(pg);
  const segPieceStart = new Int32Array(nSeg + 1);
  for (let i = 0; i < nPieces; i++) segPieceStart[pieceSeg[i] + 1]++;
  for (let i = 0; i < nSeg; i++) segPieceStart[i + 1] += segPieceStart[i];
  const fillAt = segPieceStart.slice(0, nSeg);
  const segPieces = new Int32Array(nPieces);
  for (let i = 0; i < nPieces; i++) segPieces[fillAt[pieceSeg[i]]++] = i;

  // Ports: the feed and the loads sit on nodes.
  const portAt = (path: string, wire: number, at: number): Port => {
    const nodes = nodeLists[wire];
    const L = nodes[nodes.length - 1];
    const target = at * L;
    const nSegW = nodes.length - 1;
    const live = (j: number) =>
      j === 0 ? endLive[2 * wire] === 1 : j === nSegW ? endLive[2 * wire + 1] === 1 : true;
    let best = -1;
    for (let j = 0; j <= nSegW; j++) {
      if (!live(j)) continue;
      if (best < 0 || Math.abs(nodes[j] - target) < Math.abs(nodes[best] - target)) best = j;
    }
    const exactEnd = at === 0 ? 0 : at === 1 ? nSegW : -1;
    if (exactEnd >= 0 && !live(exactEnd)) {
      throw new ModelError(
        `${path}.at`,
        `position ${at} is a free end of wire "${wires[wire].id}", where no current flows`,
      );
    }
    if (best < 0) {
      throw new ModelError(
        `${path}.wire`,
        `wire "${wires[wire].id}" has no node that carries current (give it more segments or connect it)`,
      );
    }
    if (Math.abs(nodes[best] - target) > tol) {
      warnings.push({
        code: `${path.startsWith("feed") ? "feed" : "load"}-snapped`,
        message: `${path} moved from ${(at * 100).toFixed(1)} % to the nearest node at ${((nodes[best] / L) * 100).toFixed(1)} % of wire "${wires[wire].id}"`,
        wire: wires[wire].id,
        path: `${path}.at`,
      });
    }
    const first = firstSeg[wire];
    return best < nSegW
      ? { segment: first + best, atEnd: false }
      : { segment: first + nSegW - 1, atEnd: true };
  };
  const feed = portAt("feed", feedWire, model.feed.at);
  const loadPorts = loads.map((l: LoadInput, i) => ({
    port: portAt(`loads[${i}]`, loadWires[i], l.at),
    load: l,
    index: i,
  }));

  const segs = makeSegmentSet(starts, ends, radii);
  const view = { segments: nSeg, starts, ends, radii, wireOfSegment, wireStart, wireEnd };
  const mesh: Mesh = {
    view,
    segs,
    wireIds: wires.map((w) => w.id),
    nBasis,
    pieceBasis,
    pieceSeg,
    pieceAtEnd,
    pieceSign,
    segPieceStart,
    segPieces,
    feed,
    loads: loadPorts,
    groundPorts,
    conductivity,
    warnings,
  };
  warnings.push(...geometryWarnings(mesh, lambdaMin, tol));
  return mesh;
}

function dist(a: Vec3, b: Vec3): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
}

function validateWire(model: WireModel, i: number, tol: number, ground: boolean): void {
  const w = model.wires[i];
  if (w.points.length < 2) throw new ModelError(`wires[${i}].points`, "a wire needs at least two points");
  if (!(w.radius > 0)) throw new ModelError(`wires[${i}].radius`, "the radius must be positive");
  if (Number.isNaN(conductivityOf(w.material)) || conductivityOf(w.material) <= 0) {
    throw new ModelError(
      `wires[${i}].material`,
      `unknown or non-positive conductor material ${String(w.material)}`,
    );
  }
  w.points.forEach((p, j) => {
    if (!p.every(Number.isFinite))
      throw new ModelError(`wires[${i}].points[${j}]`, "coordinates must be finite numbers");
    if (ground && p[2] < -tol) {
      throw new ModelError(
        `wires[${i}].points[${j}]`,
        `point is below the ground (z = ${p[2]} m < 0): buried wires are not modelled by any ground method here; for a driven rod give the wire that stands on z = 0 a groundConnection { "rod": { "length", "radius" } }, and lay radials on or just above the soil (z ≥ 0)`,
      );
    }
    if (j > 0 && dist(p, w.points[j - 1]) <= tol) {
      throw new ModelError(`wires[${i}].points[${j}]`, "repeats the previous point (zero-length segment)");
    }
    if (ground && j > 0 && Math.max(p[2], w.points[j - 1][2]) < w.radius) {
      throw new ModelError(
        `wires[${i}].points[${j}]`,
        "this run lies on the ground plane; raise it at least one wire radius above z = 0",
      );
    }
  });
}
