import { describe, expect, it } from "vitest";
import { measurementKindInfo, measurementKinds } from "@/lib/measurement-kinds";

describe("measurement kinds", () => {
  it("gives every kind a label and a unit", () => {
    for (const kind of measurementKinds) {
      expect(measurementKindInfo[kind].label.length).toBeGreaterThan(3);
      expect(measurementKindInfo[kind].unit.length).toBeGreaterThan(0);
    }
  });
});
