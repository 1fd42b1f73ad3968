import { describe, expect, it } from "vitest";
import { measurementKindEnum } from "@/db/schema";
import { measurementKindInfo, measurementKinds } from "@/lib/measurement-kinds";

describe("measurement kinds", () => {
  it("lists exactly the database enum's values, in its order", () => {
    expect([...measurementKinds]).toEqual(measurementKindEnum.enumValues);
  });

  it("gives every kind a label and a unit", () => {
    for (const kind of measurementKinds) {
      expect(measurementKindInfo[kind].label.length).toBeGreaterThan(3);
      expect(measurementKindInfo[kind].unit.length).toBeGreaterThan(0);
    }
  });
});
