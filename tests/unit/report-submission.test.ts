import { describe, expect, it } from "vitest";
import { decimalsForUncertainty, formatMeasured } from "@/components/report-embeds/figure-format";
import { submissionProblems, suggestDisclosure } from "@/lib/report-submission";

const known = { analysisLabels: ["full-power"], imageNames: ["bench"], toolSlugs: ["aeris-720"] };

describe("submission rules", () => {
  it("passes a body that compiles and names only what the report has", () => {
    expect(submissionProblems({ bodyMdx: '<VerdictTable analysis="full-power" />\n\n<Figure image="bench" />\n\n<SpecTable tool="aeris-720" />', known, imagesWithoutAltText: [] })).toEqual([]);
  });

  it("names every reason, with the body's lines", () => {
    expect(
      submissionProblems({
        bodyMdx: "<script>x</script>\n\n<SpecTable tool=\"other\" />",
        known: { ...known, analysisLabels: [] },
        imagesWithoutAltText: ["bench"],
      }),
    ).toEqual([
      "Cite at least one finished analysis: a report stands on measured data.",
      "Body, line 1, column 1: <script> is not allowed in reports and was removed.",
      'Body, line 3, column 1: <SpecTable> names tool "other", which this report does not cover.',
      "Image “bench” has no alt text: describe it for readers who cannot see it.",
    ]);
    expect(submissionProblems({ bodyMdx: "  \n", known, imagesWithoutAltText: [] })).toEqual(["Write the body of the report."]);
  });
});

describe("disclosure draft", () => {
  it("says once per unit how it was obtained", () => {
    const unit = { serialNumber: "AE-1", firmware: null, voltageVariant: "230 V", source: "loaned" as const, sourceNote: "by the maker, returned" };
    expect(suggestDisclosure([{ toolName: "Quillfern Aeris 720", unit }, { toolName: "Quillfern Aeris 720", unit }])).toBe(
      "Quillfern Aeris 720, serial AE-1: on loan (by the maker, returned).",
    );
  });
});

describe("figures with their uncertainty", () => {
  it("rounds the value to the place of U given to two significant digits", () => {
    expect(decimalsForUncertainty(24)).toBe(0);
    expect(decimalsForUncertainty(0.095)).toBe(3);
    expect(formatMeasured(701.234, 23.4, "W")).toBe("701 ± 23 W");
    expect(formatMeasured(2.13021, 0.0951, "A")).toBe("2.130 ± 0.095 A");
    expect(formatMeasured(4.2, null, "s")).toBe("4.2 s");
  });
});
