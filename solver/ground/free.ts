/** Free space: no ground, nothing reflected, no ground nodes. */
import type { GroundKernel } from "./kernel";

export function freeSpaceGround(): GroundKernel {
  return {
    method: "none",
    connectsAtZ0: false,
    symmetric: true,
    hasPairTerms: false,
    interpolable: true,
    beginFrequency() {},
    pairTerms() {},
    nodeImpedance() {
      return false;
    },
  };
}
