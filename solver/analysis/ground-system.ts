import type { FrequencyResult, Warning, WireModel } from "../model/types";

/**
 * Warnings about the ground system of a ground-mounted antenna over real soil: a vertical, or any feed on
 * a wire whose end stands on z = 0. Such an antenna's efficiency is set by its ground connection, and a
 * bare end on the soil or a short rod throws most of the power into the earth. We say what the loss is,
 * from the solved power budget at the middle frequency, rather than guess from the connection's type.
 *
 * Threshold: more than half the accepted power lost in the ground (3 dB) is "poor" — common practice,
 * no published source. An "ideal" connection is flagged too: it is a modelling idealisation (the soil
 * treated as a perfect conductor at that point), and every figure it produces must say so.
 */
export function groundSystemWarnings(
  model: WireModel,
  groundedWires: ReadonlySet<number>,
  results: readonly FrequencyResult[],
): Warning[] {
  if (model.ground.kind !== "real" || groundedWires.size === 0) return [];
  const out: Warning[] = [];
  for (const w of groundedWires) {
    const wire = model.wires[w];
    if (wire.groundConnection === "ideal") {
      out.push({
        code: "ground-connection-idealised",
        message: `wire "${wire.id}" uses an ideal ground connection: the soil is treated as a perfect conductor at that point (a modelling idealisation; real connections lose more)`,
        wire: wire.id,
        path: `wires[${w}].groundConnection`,
      });
    }
  }
  const feedWire = model.wires.findIndex((w) => w.id === model.feed.wire);
  const mid = results[results.length >> 1];
  if (!mid || !groundedWires.has(feedWire)) return out;
  const lost = mid.power.groundLoss / mid.power.accepted;
  if (Number.isFinite(lost) && lost > 0.5) {
    const wire = model.wires[feedWire];
    const how = wire.groundConnection ?? "contact";
    const kind = typeof how === "string" ? how : "rod" in how ? "a driven rod" : `${how.ohms} Ω`;
    out.push({
      code: "poor-ground-system",
      message: `the fed wire "${wire.id}" works against a poor ground system (${kind === "contact" ? "a bare end on the soil" : kind}): ${(100 * lost).toFixed(0)} % of the power (${(-10 * Math.log10(1 - lost)).toFixed(1)} dB) is lost in the ground at ${mid.mhz.toFixed(3)} MHz; radials or a better ground connection recover most of it`,
      wire: wire.id,
      path: `wires[${feedWire}].groundConnection`,
    });
  }
  return out;
}
