import { describe, expect, it } from "vitest";
import { z } from "zod";
import { echoableValues, fieldErrorsOf, formEntries, withIndexedRows } from "@/lib/form-data";

describe("form data helpers", () => {
  it("drops Next's action entries and never echoes files or secrets", () => {
    const data = new FormData();
    data.append("$ACTION_ID_abc", "");
    data.append("model", "Aeris 720");
    data.append("password", "hunter22");
    data.append("photo", new File(["x"], "x.png"));
    expect(Object.keys(formEntries(data))).toEqual(["model", "password", "photo"]);
    expect(echoableValues(data)).toEqual({ model: "Aeris 720" });
  });

  it("gathers indexed rows in index order and keeps the other fields", () => {
    const input = { model: "Stylo", "accessories.1.name": "Chisel tip", "accessories.0.name": "Conical tip", "accessories.0.size": "0.5 mm" };
    expect(withIndexedRows(input, ["accessories"])).toEqual({
      model: "Stylo",
      accessories: [{ name: "Conical tip", size: "0.5 mm" }, { name: "Chisel tip" }],
    });
    expect(withIndexedRows({ model: "Stylo" }, ["accessories"])).toEqual({ model: "Stylo", accessories: [] });
  });

  it("keys errors by the input name that caused them", () => {
    const schema = z.preprocess(
      (input) => withIndexedRows(input, ["rows"]),
      z.object({ rows: z.array(z.object({ name: z.string().min(1, "Name it.") })) }),
    );
    const parsed = schema.safeParse({ "rows.0.name": "ok", "rows.1.name": "" });
    expect(parsed.success).toBe(false);
    expect(fieldErrorsOf(parsed.error!)).toEqual({ "rows.1.name": ["Name it."] });
  });
});
