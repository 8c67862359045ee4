/**
 * The ground's part of the impedance-matrix fill: the one interface every ground implements.
 *
 * The fill (solver/mom/fill.ts) writes the mixed-potential Galerkin EFIE (e^{jωt}, free-space η, k):
 *
 *   Z_mn = (jη/4π) [ k ∫∫ Λ_m Λ_n t̂_m·𝐆_A·t̂_n dl′ dl  −  (1/k) ∫∫ Λ′_m Λ′_n G_φ dl′ dl ]
 *
 * with 𝐆_A = 𝐈 G + 𝐆_A^r and G_φ = G + G_φ^r, G = e^{−jkR}/R the free-space kernel (reduced thin-wire
 * distance). The free-space part is the fill's own business. A ground supplies only the reflected
 * parts 𝐆_A^r, G_φ^r, normalised like G (so a perfect-ground image of a vertical current is +G(R̃)).
 *
 * Per segment pair (observation p, source q; u, v ∈ [0, 1] along p and q) the ground ADDS into
 * `out` (re, im interleaved, 10 numbers):
 *   out[0..7]  ∫_p∫_q u^a v^b  t̂_p·𝐆_A^r(r, r′)·t̂_q  dl′ dl     for (a, b) = 00, 10, 01, 11
 *   out[8..9]  ∫_p∫_q G_φ^r(r, r′) dl′ dl                          (Λ′ is constant on a segment)
 * The fill turns these into the triangle interactions exactly as it does the free-space J_ab.
 *
 * How the known methods fit:
 *  - perfect ground (images): 𝐆_A^r = −diag(1, 1, −1)·G(R̃), G_φ^r = −G(R̃), R̃ to the mirrored source
 *    point (x′, y′, −z′). Computed with pairIntegrals() against the mirrored SegmentSet.
 *  - "reflection" (real ground, fast): the same image integrals weighted per pair by reflection
 *    coefficients at the specular angle between p and q: horizontal tangent components by one
 *    coefficient, vertical by another, G_φ^r by a third. Split t̂_p·diag(·)·t̂_q̃ by component.
 *  - "Sommerfeld" (real ground, rigorous): image terms plus a smooth correction tabulated in
 *    (ρ, z + z′) per frequency in beginFrequency(), evaluated at Gauss points on p and q inside
 *    pairTerms() (the correction is smooth, so a few points suffice). Dyadic cross terms (zx) are fine:
 *    the method forms t̂_p·𝐆_A^r·t̂_q itself.
 *
 * Symmetry: the fill loops pairs p ≤ q and mirrors them into Z_nm when `symmetric` is true
 * (reciprocity of the reflected field for the dot products above). A method whose per-pair terms are
 * not symmetric under (p, q) ↔ (q, p) sets it false and is then also asked for (q, p).
 *
 * Ground nodes: when `connectsAtZ0`, a wire end on z = 0 carries a half triangle whose image supplies
 * the other half (perfect: always an ideal connection). `nodeImpedance` is the hook for a lumped series
 * impedance between such an end and the ground (a rod or a stated resistance over real ground); the
 * fill adds it to Z_mm of that node's half triangle, and the solver books ½ Re(Z)|I|² as ground loss.
 */
import type { GroundConnection } from "../model/types";
import type { SegmentSet } from "../mom/segments";

export interface GroundFrequency {
  frequencyHz: number;
  omega: number;
  /** Free-space wavenumber, rad/m. */
  k: number;
  /** Free-space wave impedance, ohms. */
  eta: number;
}

/** Frequency-independent facts a ground may need, handed over once when it is built. */
export interface GroundSetup {
  /** The model's segments (real geometry). */
  segments: SegmentSet;
  /** The same segments mirrored in z = 0 (x, y, −z), same parametrisation. */
  mirrored: SegmentSet;
  /** Index into model.wires of each segment. */
  wireOfSegment: Int32Array;
  /** Per wire: its groundConnection as given (undefined when none was given). */
  connections: (GroundConnection | undefined)[];
  /** Lowest frequency of the model (Hz), when known: real ground's "auto" method judges heights in its wavelength. */
  lowestFrequencyHz?: number;
}

export interface GroundKernel {
  /** Name shown in results as `groundMethod`: "none", "image", "reflection", "sommerfeld", … */
  readonly method: string;
  /** Why "auto" chose a method other than the one it would by geometry alone, for a warning. */
  readonly methodNote?: string;
  /** True when z = 0 wire ends connect to the ground (half-triangle nodes). */
  readonly connectsAtZ0: boolean;
  /** True when pairTerms(p, q) equals pairTerms(q, p) with u ↔ v (the fill then asks only p ≤ q). */
  readonly symmetric: boolean;
  /** True when the ground adds anything to the pair interactions (free space: false, skip the calls). */
  readonly hasPairTerms: boolean;
  /**
   * True when the reflected terms vary with frequency like an image, e^{−jkR̃}/R̃ times slowly varying
   * factors, so sweeps may interpolate them across a band (solver/mom/interpolate.ts). Leave it
   * false or absent when unsure: every frequency is then filled in full.
   */
  readonly interpolable?: boolean;
  /** Called once per frequency, before any pairTerms (tabulate Sommerfeld integrals here). */
  beginFrequency(f: GroundFrequency): void;
  /** ADD the reflected terms of pair (p, q) into out[0..9] (layout above). */
  pairTerms(p: number, q: number, out: Float64Array): void;
  /**
   * Series impedance (ohms, [re, im] into out) between the z = 0 end of wire `wireIndex` and the
   * ground at the current frequency. Return false for an ideal connection (nothing added).
   */
  nodeImpedance(wireIndex: number, out: Float64Array): boolean;
  /**
   * Rigorous bare contact (real ground, Sommerfeld): true when the current at the z = 0 end of wire
   * `wireIndex` enters the soil there, as a point source at the surface. out = [re, im] of the factor
   * 1 − κ (κ = (ε_c − 1)/(ε_c + 1) at this frequency) by which the free-space kernel of the charge that
   * current deposits in the soil is multiplied: its direct field plus its quasi-static image. The rest
   * of that charge's reflected field is already in the Sommerfeld remainder, which acts on the half
   * triangle's current right up to its end (solver/mom/soil-contact.ts). Absent or false: no such term.
   */
  soilContact?(wireIndex: number, out: Float64Array): boolean;
  /**
   * How the z = 0 end of wire `wireIndex` joins the ground, for reports: e.g. "ideal connection (…)",
   * "2.4 m rod, ≈80.8 Ω at d.c. (Dwight 1936), at HF a lossy line in the soil (Sunde 1949): an
   * estimate". Undefined in free space.
   */
  connectionLabel?(wireIndex: number): string | undefined;
  /**
   * The series impedance (ohms, [re, im] into out) that the tie of wire `wireIndex` puts between its
   * z = 0 end and the ground at `frequencyHz`, as modelled — for a rigorous bare contact its hemisphere
   * term. False when there is none to state (an ideal tie, perfect ground, free space).
   */
  tieImpedance?(wireIndex: number, frequencyHz: number, out: Float64Array): boolean;
}
