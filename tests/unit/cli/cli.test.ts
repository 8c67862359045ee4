import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

// The command-line door: run it as a user would (through tsx), check its contract, not its physics
// (the physics has its own checks under tests/unit/mom and tests/unit/fields).
const dir = mkdtempSync(join(tmpdir(), "cli-"));
const tsx = join(process.cwd(), "node_modules", ".bin", "tsx");

function run(model: unknown, ...flags: string[]) {
  const file = join(dir, `m${Math.random().toString(36).slice(2)}.json`);
  writeFileSync(file, typeof model === "string" ? model : JSON.stringify(model));
  const r = spawnSync(tsx, ["solver/cli.ts", file, ...flags], { encoding: "utf8" });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr, file };
}

const dipole = {
  wires: [
    {
      id: "top",
      points: [
        [-5, 0, 10],
        [5, 0, 10],
      ],
      radius: 0.001,
      material: "copper",
      segments: 22,
    },
  ],
  feed: { wire: "top", at: 0.5 },
  loads: [{ wire: "top", at: 0.25, ohms: 0, henries: 1e-7, farads: 0, arrangement: "series" }],
  ground: { kind: "perfect" },
  frequenciesMHz: [14.0, 14.175, 14.35],
  referenceOhms: 50,
};

describe("npm run solve", () => {
  it("prints the documented JSON shape for the documented example", () => {
    const r = run(dipole, "--json");
    expect(r.stderr).toBe("");
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.segments).toBe(22);
    expect(out.results).toHaveLength(3);
    const first = out.results[0];
    for (const key of [
      "mhz",
      "impedance",
      "swr",
      "peakGainDbi",
      "peakElevationDeg",
      "peakBearingDeg",
      "efficiency",
    ]) {
      expect(first).toHaveProperty(key);
    }
    expect(first.impedance).toHaveLength(2);
    expect(first.currents[0].wire).toBe("top");
    expect(first.currents[0].peakAmps).toBeGreaterThan(0);
    expect(Array.isArray(out.resonancesMHz)).toBe(true);
    expect(Array.isArray(out.warnings)).toBe(true);
  });

  it("adds the far-field grid with both polarisations on --pattern", () => {
    const r = run({ ...dipole, frequenciesMHz: [14.1] }, "--json", "--pattern");
    expect(r.status).toBe(0);
    const p = JSON.parse(r.stdout).results[0].pattern;
    // Over ground: elevations 0..90 at the default 2° step, bearings 0..358.
    expect(p.elevationsDeg).toHaveLength(46);
    expect(p.bearingsDeg).toHaveLength(180);
    for (const key of ["gainDbi", "verticalDbi", "horizontalDbi"]) expect(p[key]).toHaveLength(46);
  });

  it("prints a readable table by default", () => {
    const r = run(dipole);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/MHz\s+R \(Ω\)\s+X \(Ω\)\s+SWR/);
    expect(r.stdout).toContain("14.1750");
  });

  it("says which near-ground method ran and how each grounded wire end joins the ground", () => {
    // A 5 m vertical on a 2.4 m rod over average ground, and a lifted wire that touches nothing.
    const model = {
      wires: [
        {
          id: "vertical",
          points: [
            [0, 0, 0],
            [0, 0, 5],
          ],
          radius: 0.01,
          segments: 6,
          groundConnection: { rod: { length: 2.4, radius: 0.008 } },
        },
        {
          id: "lifted",
          points: [
            [3, 0, 1],
            [3, 0, 5],
          ],
          radius: 0.01,
          segments: 4,
        },
      ],
      feed: { wire: "vertical", at: 0.1 },
      ground: { kind: "real", preset: "average ground", method: "reflection" },
      frequenciesMHz: [7.1],
    };
    const text = run(model);
    expect(text.status).toBe(0);
    expect(text.stdout).toMatch(/^ground: reflection-coefficient images.*"reflection"/m);
    expect(text.stdout).toMatch(/^ {2}wire "vertical" to ground: 2\.4 m rod, .*estimate/m);
    expect(text.stdout).not.toContain('"lifted" to ground');
    const json = JSON.parse(run(model, "--json").stdout);
    expect(json.groundMethod).toBe("reflection");
    expect(json.groundConnections).toHaveLength(1);
    expect(json.groundConnections[0].wire).toBe("vertical");
    expect(json.groundConnections[0].label).toMatch(/2\.4 m rod/);
  });

  it("a yard plan's report names the ground method and each grounded element's tie", () => {
    // The demo plan: average ground, an aluminium pole standing on the soil (bare contact).
    const r = spawnSync(tsx, ["solver/cli.ts", "public/demo-plan.json"], { encoding: "utf8" });
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^Ground: rigorous half-space \(Sommerfeld\)/m);
    expect(r.stdout).toMatch(/^ {2}pole to ground: bare contact: .*Sommerfeld/m);
    const j = JSON.parse(
      spawnSync(tsx, ["solver/cli.ts", "public/demo-plan.json", "--json"], { encoding: "utf8" }).stdout,
    );
    expect(j.groundMethod).toBe("sommerfeld");
    expect(j.groundConnections.map((c: { elementId: string }) => c.elementId)).toEqual(["pole"]);
    expect(r.stdout).toMatch(/^ {2}ground tie {10}pole: [\d.]+ [−+] j[\d.]+ Ω in series at 14\.\d{3} MHz/m);
    expect(j.bands[0].groundTies[0].elementId).toBe("pole");
    expect(j.bands[0].groundTies[0].ohms).toHaveLength(2);
  }, 60_000);

  it("exits 2 with one line naming the field for a malformed model", () => {
    const bad = {
      ...dipole,
      wires: [
        dipole.wires[0],
        {
          id: "b",
          points: [
            [0, 0],
            [1, 1, 1],
          ],
          radius: 0.001,
        },
      ],
    };
    const r = run(bad, "--json");
    expect(r.status).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderr.trim().split("\n")).toHaveLength(1);
    expect(r.stderr).toContain("wires[1].points[0]: expected three numbers");
  });

  it("exits 2 for a file that is not JSON, without a stack trace", () => {
    const r = run("{ wires: nope");
    expect(r.status).toBe(2);
    expect(r.stderr).toContain("not valid JSON");
    expect(r.stderr).not.toContain("    at ");
  });

  it("exits 2 for a geometric problem found after parsing (a zero-length wire)", () => {
    const bad = {
      ...dipole,
      loads: [],
      wires: [
        {
          id: "top",
          points: [
            [1, 0, 10],
            [1, 0, 10],
          ],
          radius: 0.001,
        },
      ],
    };
    const r = run(bad);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/wires\[0\]/);
  });
});
