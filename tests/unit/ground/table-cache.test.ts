import { describe, expect, it } from "vitest";
import { sharedSommerfeldTable } from "../../../solver/ground/sommerfeld-table";

// Cache policy, not physics: a plan analysis over two bands visits ~20 frequencies (five per band on a
// live pass, the full pass's fit frequencies, the reference dipole's), and every one of those tables
// must still be there on the next pass, or each live pass rebuilds them all.
describe("shared Sommerfeld tables", () => {
  it("keep the tables of a two-band analysis between passes", () => {
    const params = (f: number) => {
      const omega = 2 * Math.PI * f;
      return { k0: omega / 299_792_458, epsRe: 13, epsIm: -0.005 / (omega * 8.8541878128e-12) };
    };
    const freqs = Array.from({ length: 24 }, (_, i) => 1.8e6 + i * 0.05e6);
    const first = freqs.map((f) => sharedSommerfeldTable(params(f), { rMax: 2 }));
    const again = freqs.map((f) => sharedSommerfeldTable(params(f), { rMax: 2 }));
    for (const [i, t] of again.entries()) expect(t).toBe(first[i]);
    // A larger model needs a table reaching further: rebuilt, not the short one.
    expect(sharedSommerfeldTable(params(freqs[0]), { rMax: 10 })).not.toBe(first[0]);
  });
});
