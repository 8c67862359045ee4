import { describe, expect, it } from "vitest";
import { analyzePlan } from "../../../solver/plan/analyze";
import { bandEdges } from "../../../solver/plan/bands";
import { type BandName, type PlanGround, parsePlan } from "../../../solver/plan/schema";
import { buildTemplate, planResonanceNear, TEMPLATE_KINDS } from "../../../solver/plan/templates";

// Ordinary soil ("average ground": σ = 5 mS/m, εr = 13; common practice, solver/ground/presets.ts).
const GROUND: PlanGround = { kind: "real", preset: "average ground" };

/** Two trees `span` metres apart on the x axis, both usable to `height`. */
function yard(band: BandName, span: number, height: number) {
  return parsePlan({
    version: 1,
    lot: {
      outline: [
        [-30, -30],
        [30, -30],
        [30, 30],
      ],
    },
    ituRegion: 1,
    bands: [band],
    ground: GROUND,
    supports: [
      { type: "tree", id: "a", position: [0, 0], height },
      { type: "tree", id: "b", position: [span, 0], height },
    ],
    // A placeholder run (replaced by each template) so the plan is valid on its own.
    wireRuns: [
      {
        id: "placeholder",
        anchors: [
          { kind: "free", id: "p1", position: [0, 20, 3] },
          { kind: "free", id: "p2", position: [1, 20, 3] },
        ],
        wire: { awg: 14 },
        feed: { at: 0.5 },
      },
    ],
  });
}
const only = (t: ReturnType<typeof buildTemplate>) => ({ ...t.plan, wireRuns: [t.run] });

describe("templates", () => {
  // Wide spans for the layouts that need the room, a short one for those that bend to fit.
  const SPAN: Record<string, number> = { "drooped-dipole": 7, "z-dipole": 7, "l-dipole": 7 };
  it.each(TEMPLATE_KINDS)("%s resonates inside the 20 m band after trimming", (kind) => {
    const t = buildTemplate(yard("20 m", SPAN[kind] ?? 14, 10), { kind, band: "20 m", from: "a", to: "b" });
    const band = bandEdges("20 m", 1);
    const b = analyzePlan(only(t), { quick: true }).bands[0];
    if (kind === "end-fed-half-wave") {
      // Fed against a short counterpoise it stays capacitive through its high-impedance peak, so the
      // resonance the user tunes is the SWR minimum against the 49:1 (2450 Ω) reference: it must fall
      // strictly inside the band, not at an edge.
      expect(b.swrMinMHz).toBeGreaterThan(band.lowMHz);
      expect(b.swrMinMHz).toBeLessThan(band.highMHz);
    } else {
      expect(b.resonancesMHz.some((f) => f >= band.lowMHz && f <= band.highMHz)).toBe(true);
    }
  });

  // 468 / f(MHz) feet for a half-wave dipole: common practice, no published source. A typical backyard
  // 40 m dipole at 10 m. (Over perfect ground the trimmed length strays up to ~3.5 % from it on 20 m
  // at 0.45–0.5 λ, where the image pushes the resonance down.)
  it("straight dipole trims to within 3 % of 468/f feet", () => {
    const t = buildTemplate(yard("40 m", 24, 10), {
      kind: "straight-dipole",
      band: "40 m",
      from: "a",
      to: "b",
    });
    const handbook = (468 / 7.1) * 0.3048;
    expect(Math.abs(t.lengthM / handbook - 1)).toBeLessThan(0.03);
  });

  // Trade facts (common practice, no published source): ends drooped or bent to fit a short yard, the
  // dipole still resonates after trimming and gives up a fraction of a dB to about 1 dB of peak gain
  // (0.2–2 dB) against the straight dipole at the same height.
  const straight = analyzePlan(
    only(buildTemplate(yard("20 m", 14, 10), { kind: "straight-dipole", band: "20 m", from: "a", to: "b" })),
  ).bands[0];
  it.each(["drooped-dipole", "z-dipole"] as const)(
    "%s gives up 0.2–2 dB against the straight dipole",
    (kind) => {
      const t = buildTemplate(yard("20 m", 7, 10), { kind, band: "20 m", from: "a", to: "b" });
      const b = analyzePlan(only(t)).bands[0];
      expect(b.resonancesMHz.some((f) => f >= b.lowMHz && f <= b.highMHz)).toBe(true);
      const loss = straight.peakGainDbi - b.peakGainDbi;
      expect(loss).toBeGreaterThan(0.2);
      expect(loss).toBeLessThan(2);
    },
  );

  // The drooped ends come down toward the soil: a little more ground loss (more, by under 10 points of
  // the accepted power). Not asserted for the Z-bent dipole, whose ends stay at full height: this engine
  // finds its ground loss the same as the straight dipole's to within 0.1 point.
  it("drooped-dipole loses a little more in the ground than the straight dipole", () => {
    const t = buildTemplate(yard("20 m", 7, 10), {
      kind: "drooped-dipole",
      band: "20 m",
      from: "a",
      to: "b",
    });
    const extra = analyzePlan(only(t)).bands[0].power.groundLoss - straight.power.groundLoss;
    expect(extra).toBeGreaterThan(0);
    expect(extra).toBeLessThan(0.1);
  });

  // The ideal-dipole reference of a plan that already is the ideal dipole (straight, level, centre-fed,
  // trimmed at the band centre) must agree with it: the comparison's zero.
  it("ideal-dipole reference of a straight dipole plan differs by under 0.1 dB", () => {
    expect(Math.abs(straight.vsIdealDipoleDb)).toBeLessThan(0.1);
    expect(Math.abs(straight.vsIdealAtTakeoffDb)).toBeLessThan(0.1);
  });

  // Trade fact (common practice, no published source): an inverted V resonates lower than the same
  // wire strung straight at the apex height. The usual case: an 80 m V from one 12 m support, 120°
  // included angle, ends about 2 m up. (This engine finds the V resonating HIGHER by 0.5–1 % when its
  // ends stay above ~0.1 λ — e.g. 40 m from 12 m, ends at 7 m — so the fact holds for low ends only.)
  it("inverted V resonates lower than the same wire straight", () => {
    const v = buildTemplate(yard("80 m", 40, 12), { kind: "inverted-v", band: "80 m", from: "a", to: "b" });
    const half = v.lengthM / 2;
    const flat = parsePlan({
      ...only(v),
      wireRuns: [
        {
          id: "flat",
          anchors: [
            { kind: "free", id: "f1", position: [-half, 0, 12] },
            { kind: "free", id: "f2", position: [half, 0, 12] },
          ],
          wire: { awg: 14 },
          feed: { at: 0.5 },
        },
      ],
      analysis: {},
    });
    const fV = planResonanceNear(only(v), 3.65)!;
    const fFlat = planResonanceNear(flat, 3.65)!;
    expect(fV).toBeLessThan(fFlat);
  });
});
